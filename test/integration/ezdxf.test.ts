// ezdxf (Debian python3-ezdxf) reads our DXF with its strict reader and audits it: 0 errors is
// our bar (ecosystem.md). The script: scripts/fixtures/ezdxf_audit.py.
import { beforeAll, describe, expect, it } from 'vitest';
import { FIXTURES } from '../golden/fixtures.js';
import { auditWithEzdxf, ezdxfMissing, type EzdxfAudit } from '../helpers/dxfOracle.js';
import { writeDxf } from '../../src/writers/dxf.js';

const missing = ezdxfMissing();
if (missing) console.warn(`skip: ${missing}`);

describe.skipIf(missing !== null)('ezdxf audit', () => {
  let audits: EzdxfAudit[] = [];
  let broken: EzdxfAudit | undefined;
  let brokenDiffers = false;
  beforeAll(() => {
    const texts = FIXTURES.map((f) => writeDxf(f.geometry, f.meta).text);
    // A layer name with characters DXF forbids ('<', '>'): ezdxf's audit reports it as an error.
    // (It silently tolerates wrong owner handles, so that is not a usable break.)
    const bad = texts[0]!.replace('  8\nCOPPER_TOP\n', '  8\nNO<SUCH>\n');
    brokenDiffers = bad !== texts[0];
    const all = auditWithEzdxf([...texts, bad]);
    audits = all.slice(0, FIXTURES.length);
    broken = all[FIXTURES.length];
  });

  it.each(FIXTURES.map((f, i) => [f.name, f, i] as const))('%s: 0 errors, 0 fixes, units mm, closed copper', (_name, f, i) => {
    const a = audits[i]!;
    expect(a.errors).toEqual([]);
    expect(a.fixes).toEqual([]);
    expect(a.loadWarnings).toEqual([]);
    expect(a.dxfversion).toBe('AC1015');
    expect(a.insunits).toBe(4); // Autodesk DXF Reference: $INSUNITS 4 = millimetres
    expect(a.measurement).toBe(1); // Autodesk DXF Reference: $MEASUREMENT 1 = metric
    const copper = f.geometry.copper.reduce((n, c) => n + 1 + c.holes.length, 0);
    expect(a.entities['COPPER_TOP:LWPOLYLINE']).toBe(copper);
    expect(a.entities['DRILL:LWPOLYLINE'] ?? 0).toBe(f.geometry.vias.length);
    expect(Object.keys(a.entities).filter((k) => /:(LINE|CIRCLE)$/.test(k))).toEqual([]);
    expect(a.entities['PORTS:TEXT']).toBe(2);
    expect(a.closedPolylines).toBeGreaterThanOrEqual(copper);
  });

  it('flags a broken file, so the audit can fail', () => {
    expect(brokenDiffers).toBe(true);
    expect(broken!.errors.length).toBeGreaterThan(0);
  });
});
