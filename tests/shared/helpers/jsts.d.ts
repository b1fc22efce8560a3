// jsts ships no type declarations; the tests use it only as an independent planar oracle.
declare module 'jsts/org/locationtech/jts/io/GeoJSONReader.js';
declare module 'jsts/org/locationtech/jts/monkey.js';
