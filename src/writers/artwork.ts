// The artwork writers, gathered so the rest of the pipeline imports them from one place.
export { writeDxf } from './dxf.js';
export { writeSvg } from './svg.js';
export { writeGerberCopper, writeGerberProfile, writeGerberKeepout } from './gerber.js';
export { writeDrill } from './drill.js';
export type { ArtworkMeta } from './units.js';
