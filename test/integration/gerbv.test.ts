// Layer 3 of the Gerber oracle: gerbv (Debian package gerbv) renders our copper, profile and drill
// files. Its stderr must hold no CRITICAL/WARNING beyond "Unknown RS-274X extension" (it does not
// read X2 attributes, ecosystem.md), and the copper pixel area at 600 dpi must be within 3 % of the
// hand-worked area (ecosystem.md: a pixel count at 600 dpi lands within about 2 %).
import { describe, expect, it } from 'vitest';
import { FIXTURES } from '../golden/fixtures.js';
import { GERBV, hasGerbv, renderWithGerbv } from '../helpers/gerberOracle.js';
import { writeGerberCopper, writeGerberProfile } from '../../src/writers/gerber.js';
import { writeDrill } from '../../src/writers/drill.js';

const has = hasGerbv();
if (!has) console.warn(`skip: gerbv not installed (${GERBV}); apt-get install -y gerbv`);

describe.skipIf(!has)('gerbv renders our files', () => {
  it.each(FIXTURES)('$name copper: no complaints, area within 3 %', (f) => {
    const art = writeGerberCopper(f.geometry, f.meta);
    const r = renderWithGerbv([{ name: art.path, text: art.text }]);
    expect(r.complaints).toEqual([]);
    expect(Math.abs(r.copperArea - f.analyticAreaMm2) / f.analyticAreaMm2).toBeLessThan(0.03);
  });

  it('an empty (background-only) render counts no copper, so the area check can fail', () => {
    const f = FIXTURES[0]!;
    const art = writeGerberCopper(f.geometry, f.meta);
    // The same file with the region removed: only the unused aperture is left.
    const blank = art.text.replace(/%TA\.AperFunction,Conductor\*%\nG36\*[\s\S]*?G37\*\n%TD\*%\n/, '');
    expect(blank).not.toContain('G36');
    const r = renderWithGerbv([{ name: 'blank.gbr', text: blank }]);
    expect(r.copperArea).toBeLessThan(0.01 * f.analyticAreaMm2);
  });

  it.each(FIXTURES.filter((f) => f.geometry.area))('$name profile: no complaints', (f) => {
    const art = writeGerberProfile(f.geometry, f.meta)!;
    expect(renderWithGerbv([{ name: art.path, text: art.text }]).complaints).toEqual([]);
  });

  it('drill file: no complaints, holes drawn', () => {
    const f = FIXTURES[1]!;
    const art = writeDrill(f.geometry, f.meta)!;
    const r = renderWithGerbv([{ name: art.path, text: art.text }]);
    expect(r.complaints).toEqual([]);
    // Three 0.3 mm holes: 3 π 0.15² ≈ 0.212 mm²; at 600 dpi a 0.3 mm hole is 7 pixels across, so
    // only a loose check (within 25 %) that the holes are there at about the right size.
    const holes = 3 * Math.PI * 0.15 ** 2;
    expect(Math.abs(r.copperArea - holes) / holes).toBeLessThan(0.25);
  });
});
