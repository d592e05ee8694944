/** Number formatting shared by the networks screens (no Intl options that differ across engines). */
export function formatVolume(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const rounded = Math.round(v * 100) / 100;
  const [int, frac] = String(Math.abs(rounded)).split('.');
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ','); // the same thousands separator as the runs and billing screens
  return `${rounded < 0 ? '−' : ''}${grouped}${frac ? `.${frac}` : ''}`;
}

/** Dates as everywhere in the app (components/ui/dates.ts). */
export { formatDateTime as formatWhen } from '../ui/dates';

export const plural = (n: number, one: string, many = `${one}s`) => `${formatVolume(n)} ${n === 1 ? one : many}`;
