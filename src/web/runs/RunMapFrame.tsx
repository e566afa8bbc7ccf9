/**
 * The run map's outline, drawn on the server and handed to the client run page
 * as a finished element (`RunPage`'s `map` prop); the selection-dependent
 * overlay inside it is the client `RunMapLayer`.
 */
import { WorldFrame } from '@/src/web/map/WorldFrame';
import { RunMapLayer } from './RunMap';
import { MAP_SIZE } from './map-size';

const WIDTH = MAP_SIZE.width;
const HEIGHT = MAP_SIZE.height;

export function RunMapFrame() {
  return (
    <WorldFrame
      width={WIDTH}
      height={HEIGHT}
      title="Source regions of the selected minimum"
      description="Regions shaded by estimated intensity; moving regions with their spread and the 68 % and 95 % confidence ellipses of their centre; stations marked by fit quality or as without data."
    >
      <RunMapLayer width={WIDTH} height={HEIGHT} />
    </WorldFrame>
  );
}
