// What would fix a failed bearing pressure under crawler tracks: rigid mats laid across the track
// (common practice, no source, as for mats under outriggers) spread the track pressure over the mat
// length, p_ground = p_track × shoe width ÷ mat length, when they cover the track length in contact.
// So the mat length across the track that brings the peak to the allowable is
// p_track × shoe width ÷ allowable, and the mats along each track must cover the contact length
// (the number of mats of the width entered is contact ÷ mat width, rounded up).
import { f, term, type Ctx } from '../context';
import { formatQuantity } from '../format';
import { si } from '../units';
import type { Fix } from '../types';

export function trackMatFix(
  ctx: Ctx,
  trackPeak: number,
  shoe: number,
  contact: number,
  allowable: number,
): Fix | null {
  if (!(trackPeak > 0) || !(allowable > 0) || !Number.isFinite(trackPeak)) return null;
  const across = (trackPeak * shoe) / allowable;
  const mat = ctx.input.ground?.mat;
  const width = mat ? si(mat.width)! : null;
  const count = width ? Math.ceil(contact / width - 1e-9) : null;
  const L = (v: number) => formatQuantity(v, 'length', ctx.system);
  const message = `Lay mats at least ${L(across)} long across each track, covering the ${L(contact)} of track in contact${
    count !== null && width !== null ? ` (${count} mats ${L(width)} wide per track)` : ''
  }, on ground that carries it.`;
  return {
    checkId: 'ground-bearing',
    kind: 'track_mat_length',
    value: across,
    unit: 'length',
    formula: f`mat length across the track = track peak ${term(trackPeak, 'pressure')} × shoe ${term(shoe, 'length')} ÷ allowable ${term(
      allowable,
      'pressure',
    )} = ${term(across, 'length')}; mats along the track cover ${term(contact, 'length')}`,
    message,
    text: message,
  };
}
