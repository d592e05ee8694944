/** Number formatting shared by the networks screens (no Intl options that differ across engines). */
export function formatVolume(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const rounded = Math.round(v * 100) / 100;
  const [int, frac] = String(Math.abs(rounded)).split('.');
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ','); // the same thousands separator as the runs and billing screens
  return `${rounded < 0 ? '−' : ''}${grouped}${frac ? `.${frac}` : ''}`;
}

export function formatWhen(iso: string): string {
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

export const plural = (n: number, one: string, many = `${one}s`) => `${formatVolume(n)} ${n === 1 ? one : many}`;
