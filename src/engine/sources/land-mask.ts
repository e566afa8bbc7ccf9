/**
 * Land mask from Natural Earth 1:110m land polygons as packaged by world-atlas
 * (land-110m.json, TopoJSON), tested with d3-geo's spherical point-in-polygon.
 * Each polygon's spherical bounding box (d3 geoBounds) screens points first.
 */
import { geoBounds, geoContains } from 'd3-geo';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import landTopology from 'world-atlas/land-110m.json';
import { inBox, type GlobalGrid, type LatLonBox } from './grid';

type Piece = { box: LatLonBox; shape: GeoJSON.Feature<GeoJSON.Polygon> };
let pieces: Piece[] | null = null;

function landPieces(): Piece[] {
  if (!pieces) {
    const topo = landTopology as unknown as Topology<{ land: GeometryCollection }>;
    const fc = feature(topo, topo.objects.land) as GeoJSON.FeatureCollection;
    pieces = [];
    for (const f of fc.features) {
      const g = f.geometry;
      const polys = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
      for (const coordinates of polys) {
        const shape: GeoJSON.Feature<GeoJSON.Polygon> = {
          type: 'Feature',
          properties: {},
          geometry: { type: 'Polygon', coordinates },
        };
        const [[lonMin, latMin], [lonMax, latMax]] = geoBounds(shape);
        pieces.push({ box: { latMin, latMax, lonMin, lonMax }, shape });
      }
    }
  }
  return pieces;
}

export function isLand(lat: number, lon: number): boolean {
  for (const p of landPieces()) if (inBox(p.box, lat, lon) && geoContains(p.shape, [lon, lat])) return true;
  return false;
}

/** Ids of the grid cells inside the box whose centre is on land. */
export function landCellsInBox(grid: GlobalGrid, box: LatLonBox): number[] {
  return grid.cells.filter((c) => inBox(box, c.lat, c.lon) && isLand(c.lat, c.lon)).map((c) => c.id);
}
