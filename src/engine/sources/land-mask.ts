/**
 * Land mask from Natural Earth 1:110m land polygons as packaged by world-atlas
 * (land-110m.json, TopoJSON), tested with d3-geo's spherical point-in-polygon.
 */
import { geoContains } from 'd3-geo';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import landTopology from 'world-atlas/land-110m.json';
import { inBox, type GlobalGrid, type LatLonBox } from './grid';

let land: GeoJSON.FeatureCollection | GeoJSON.Feature | null = null;

function landFeature(): GeoJSON.FeatureCollection | GeoJSON.Feature {
  if (!land) {
    const topo = landTopology as unknown as Topology<{ land: GeometryCollection }>;
    land = feature(topo, topo.objects.land);
  }
  return land;
}

export function isLand(lat: number, lon: number): boolean {
  return geoContains(landFeature(), [lon, lat]);
}

/** Ids of the grid cells inside the box whose centre is on land. */
export function landCellsInBox(grid: GlobalGrid, box: LatLonBox): number[] {
  return grid.cells.filter((c) => inBox(box, c.lat, c.lon) && isLand(c.lat, c.lon)).map((c) => c.id);
}
