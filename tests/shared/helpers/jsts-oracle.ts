/**
 * jsts (the JavaScript port of the JTS Topology Suite) as an independent planar oracle for the
 * takeoff's geometry. Imported by path: the package has no main entry, and
 * monkey.js adds union/difference/intersection/buffer to geometries.
 */
import GeoJSONReader from 'jsts/org/locationtech/jts/io/GeoJSONReader.js';
import 'jsts/org/locationtech/jts/monkey.js';

type Pt = readonly [number, number] | number[];
/** A jsts Geometry (untyped). */
export type JstsGeometry = {
  getArea(): number;
  union(g: JstsGeometry): JstsGeometry;
  difference(g: JstsGeometry): JstsGeometry;
  intersection(g: JstsGeometry): JstsGeometry;
  buffer(d: number, quadrantSegments?: number): JstsGeometry;
  isValid(): boolean;
};

const reader = new GeoJSONReader();

function close(ring: readonly Pt[]): number[][] {
  const r = ring.map((p) => [p[0], p[1]]);
  const a = r[0];
  const b = r[r.length - 1];
  if (a[0] !== b[0] || a[1] !== b[1]) r.push([a[0], a[1]]);
  return r;
}

/** A jsts polygon from rings (outer first, then holes). */
export function jstsPolygon(rings: readonly (readonly Pt[])[]): JstsGeometry {
  return reader.read({ type: 'Polygon', coordinates: rings.map(close) });
}

/** Union of many jsts geometries (empty list: an empty polygon). */
export function jstsUnionAll(geoms: JstsGeometry[]): JstsGeometry {
  if (!geoms.length) return reader.read({ type: 'Polygon', coordinates: [] });
  return geoms.reduce((acc, g) => acc.union(g));
}
