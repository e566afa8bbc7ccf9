/**
 * The one way figures reach Observable Plot: a dynamic import (of `plot-kit`, the
 * marks we use) shared by every `PlotFigure`, so the chart code (Plot and the d3
 * modules it pulls in) is a separate chunk, fetched while the page hydrates and
 * only once however many figures a page draws.
 */
export type PlotModule = typeof import('./plot-kit');

let loading: Promise<PlotModule> | null = null;

export function loadPlot(): Promise<PlotModule> {
  loading ??= import('./plot-kit').then(
    (mod) => {
      performance.mark('chart code ready'); // shows in a browser profile's timings
      return mod;
    },
    (e: unknown) => {
      loading = null; // let a later figure try again (e.g. after a dropped connection)
      throw e;
    },
  );
  return loading;
}
