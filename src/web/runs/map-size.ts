/** Size the run map's frame is drawn at (server outline and client overlay share it). */
export const MAP_SIZE = { width: 900, height: 460 } as const;
