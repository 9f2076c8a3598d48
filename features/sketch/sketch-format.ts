// The sketch's number labels: short, so they fit beside a part at phone width.

export function formatNm(wavelengthNm: number): string {
  return `${formatNumberShort(wavelengthNm)} nm`;
}

export function formatDeg(angleDeg: number): string {
  return `${(Math.round(angleDeg * 100) / 100).toFixed(Math.abs(angleDeg) >= 100 ? 1 : 2)}°`;
}

export function formatNumberShort(value: number): string {
  const abs = Math.abs(value);
  if (abs >= 1000 || Number.isInteger(value)) return String(Math.round(value * 10) / 10);
  return String(Number(value.toPrecision(4)));
}
