// The full-wave runs (scripts/fullwave/results.json) known to miss the acceptance of the project
// issue "Lengths that hold after fabrication", each with why; shared by every test that holds the
// recorded runs to that acceptance, so a miss is listed, and explained, once.

/** What identifies one recorded run: the design and how its copper was drawn and meshed. */
export interface RecordedRun {
  readonly name: string;
  readonly copper_model: string;
  readonly offset_percent: number;
  readonly s11_db_at_f0: number;
}

/** A recorded run's name: the design and the copper model it was simulated with. */
export const runLabel = (d: Pick<RecordedRun, 'name' | 'copper_model'>): string => `${d.name}, copper as ${d.copper_model}`;

/**
 * Recorded runs that miss the acceptance, keyed by design and copper model, each with what is known.
 * Listed, not hidden: fullwave-results.test.ts checks that each of them really misses it, so a fixed
 * one must leave this list.
 */
export const OUTSIDE_ACCEPTANCE: Readonly<Record<string, string>> = {
  'fw-1g8-complex-target, copper as zero-thickness sheet':
    'a complex target (25+j15 Ω) through a 6 mm lead, a broad match (return loss ≥ 10 dB over 1.44–2.16 GHz in tunestrip\'s model), so a small error at f0 moves its minimum far: −2.26 % in the twelfth round (−2.99 % with the eleventh round\'s tee correction), −32.9 dB at f0; drawn as solid 35 µm copper it lands at −1.92 %, inside, and designed for zero-thickness copper (fw-1g8-complex-target-t0) at −1.08 %; tunestrip\'s own network of the same sheet copper put −1.2 % of the earlier miss on the sheet-vs-35 µm convention and −0.6 % on the FDTD line impedance; it lands 1.05 % below tunestrip\'s zero-thickness-sheet prediction (−1.21 %, fourteenth round); with edge lines on the copper\'s edges 35 µm apart instead of the thirds rule the same sheet lands at −0.66 % (the FDTD feed line reads 49.92 Ω there against 50.71 Ω, Hammerstad–Jensen 50.45 Ω), and solid copper at −0.47 % (one cell across it) and −0.60 % (two cells) (fifteenth round); with edge lines 17.5 µm apart the sheet lands at −0.71 % (seventeenth round): the miss lies inside the FDTD\'s own edge-mesh spread (open in the project issue)',
  'fw-1g5-fr4-short-fold-l, copper as zero-thickness sheet, edge lines 1 per copper thickness':
    'a short stub on one via, folded once, on 1.6 mm FR-4 at 1.5 GHz: −1.46 % at the recorded setting (thirds rule at the copper\'s edges, inside), −2.19 % with edge lines 35 µm apart (eighteenth round), −26.3 dB at f0; 2.17 % below tunestrip\'s zero-thickness-sheet prediction (−0.03 %); every short stub run with fine edges lands below that prediction (−0.34…−2.17 %), the two folded ones furthest; the bare via with fine edges is only 0.6–2.5 % more inductive than its thirds-rule extraction for 30–50 Ω lines (5.6 % for one 80 Ω line), too little to explain it (open in the project issue)',
};

/** The acceptance: return-loss minimum within ±2 % of f0 and |S11(f0)| ≤ −15 dB. */
export const meetsAcceptance = (r: RecordedRun): boolean => Math.abs(r.offset_percent) <= 2 && r.s11_db_at_f0 <= -15;
