export type { ForwardSource } from './types';
export { spotNodes, spotNodesInto, SPOT_MAX_NODES, SPOT_STRIDE, type SpotNode } from './spot';
export { makeGlobalGrid, cellsInBox, regionSources, inBox, type GlobalGrid, type GridCell, type LatLonBox } from './grid';
