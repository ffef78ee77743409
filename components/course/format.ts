/** Metres as figures: "8.29 m", "-0.30 m", "178 mm" for small ones. */
export function metres(m: number, digits = 2): string {
  return `${m.toFixed(digits)} m`;
}

export function lengthLabel(m: number): string {
  return Math.abs(m) < 0.1 ? `${Math.round(m * 1000)} mm` : `${m.toFixed(2)} m`;
}
