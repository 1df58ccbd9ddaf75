// Numbers inside the engine's messages (warnings, notes, flag reasons): significant figures,
// no float noise, plain ASCII, so the CLI, the API and the screens carry the same text.

/** `x` to `digits` significant figures without trailing zeros: 236.956 → "237"; NaN stays "NaN". */
export const fmt = (x: number, digits = 3): string =>
  Number.isFinite(x) ? Number(x.toPrecision(digits)).toString() : String(x);
