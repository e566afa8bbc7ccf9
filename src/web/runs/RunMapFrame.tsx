/**
 * The run map's outline, drawn on the server and handed to the client run page
 * as a finished element (`RunPage`'s `map` prop); the selection-dependent
 * overlay inside it is the client `RunMapLayer`.
 */
import { WorldFrame } from '@/src/web/map/WorldFrame';
import { RunMapLayer } from './RunMap';

const WIDTH = 900;
const HEIGHT = 460;

export function RunMapFrame() {
  return (
    <WorldFrame
      width={WIDTH}
      height={HEIGHT}
      title="Source regions of the selected minimum"
      description="Regions shaded by estimated intensity; moving centres with 1- and 2-sigma ellipses; stations coloured by fit quality."
    >
      <RunMapLayer width={WIDTH} height={HEIGHT} />
    </WorldFrame>
  );
}
