// The original pages as the stamp builder sees them without loading them: each page's boxes
// and rotation read by qpdf, the display frame they give, and page 1's ink (page-ink.ts) for
// placing the stamp block. A document qpdf cannot read is refused with qpdf's message.
import { QpdfError, readStructure, inherited, type QValue } from '../../lib/pdf-tools/qpdf';
import { PageInkError, readPageInk, type PageInk } from '../../lib/pdf-tools/page-ink';
import type { PageFrame } from './page-frame-pdf';

export class StampInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'StampInputError';
  }
}

export type Box = [number, number, number, number];

function boxOf(v: QValue | undefined): Box | null {
  if (!Array.isArray(v) || v.length !== 4 || !v.every((n) => typeof n === 'number')) return null;
  const [a, b, c, d] = v as number[];
  return [Math.min(a, c), Math.min(b, d), Math.max(a, c), Math.max(b, d)];
}

export interface OriginalPage {
  media: Box;
  crop: Box | null;
  rotate: number;
}

/** Each page's boxes and rotation, read by qpdf; a document qpdf cannot read is refused. */
export async function originalPages(file: string, name: string): Promise<OriginalPage[]> {
  try {
    const s = await readStructure(file);
    return s.pages.map((p) => ({
      media: boxOf(inherited(s, p.object, '/MediaBox')) ?? [0, 0, 612, 792],
      crop: boxOf(inherited(s, p.object, '/CropBox')),
      rotate: Number(inherited(s, p.object, '/Rotate') ?? 0) || 0,
    }));
  } catch (err) {
    if (err instanceof QpdfError)
      throw new StampInputError(`${name} could not be read as a PDF (${err.message}).`);
    throw err;
  }
}

export function frameFromBoxes(o: OriginalPage): PageFrame {
  const v = o.crop ?? o.media;
  const box = { x: v[0], y: v[1], width: v[2] - v[0], height: v[3] - v[1] };
  const rotation = ((((Math.round(o.rotate / 90) * 90) % 360) + 360) % 360) as PageFrame['rotation'];
  const turned = rotation === 90 || rotation === 270;
  return { box, rotation, width: turned ? box.height : box.width, height: turned ? box.width : box.height };
}

/** Page 1's ink (page-ink.ts), or null when poppler cannot render it: then the stamp takes the cover sheet. */
export async function firstPageInk(file: string, o: OriginalPage, work: string): Promise<PageInk | null> {
  const frame = frameFromBoxes(o);
  try {
    return await readPageInk(file, 1, frame, work);
  } catch (err) {
    if (err instanceof PageInkError) return null;
    throw err;
  }
}
