// Every file a design writes, in a fixed order. Writers are pure: geometry and records in, text out.
import type { Artifact } from '../seams.js';
import { writeDxf, writeSvg, writeGerberCopper, writeGerberProfile, writeGerberKeepout, writeDrill, type ArtworkMeta } from './artwork.js';
import { writeDesignJson, type DesignRecordInput } from './json.js';
import { writeTouchstone } from './touchstone.js';
import { writeReport } from './report.js';
import { impedanceText, trimmed } from '../format.js';

export function artworkMeta(input: DesignRecordInput): ArtworkMeta {
  const { spec } = input;
  return {
    name: spec.name,
    version: input.version,
    notes: [
      `design ${spec.name}: f0 ${trimmed(spec.frequency / 1e9, 6)} GHz, load ${impedanceText(spec.load.re, spec.load.im)} ohm, target ${impedanceText(spec.target.re, spec.target.im)} ohm`,
      'verify by EM simulation or measurement before use',
    ],
  };
}

export function writeArtifacts(input: DesignRecordInput): Artifact[] {
  const meta = artworkMeta(input);
  const g = input.geometry;
  const optional = [writeGerberProfile(g, meta), writeGerberKeepout(g, meta), writeDrill(g, meta)].filter((a): a is Artifact => a !== null);
  return [
    writeDxf(g, meta),
    writeSvg(g, meta),
    writeGerberCopper(g, meta),
    ...optional,
    writeDesignJson(input),
    writeTouchstone(input.spec, input.response, 'physical'),
    writeTouchstone(input.spec, input.response, 'ideal'),
    writeReport(input),
  ];
}
