/**
 * The parts of Observable Plot our figures use, re-exported by name so the bundler can leave out
 * the marks and transforms nobody draws (Delaunay, hexbin, contours, trees, …) from the chart
 * chunk. A figure that needs another mark adds it here; TypeScript (`PlotModule`) says so.
 */
export { plot, dot, line, areaY, cell, text, ruleX, ruleY, rect, rectX, raster } from '@observablehq/plot';
