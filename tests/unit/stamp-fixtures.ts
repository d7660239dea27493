// Inputs for the stamped-return tests: two small plan PDFs made with pdf-lib (a 2-page lift
// plan whose second page's MediaBox starts at 50,100, and a 1-page drawing turned with
// /Rotate 90), markups of every kind, and a real engine result for an example lift.
import { readFileSync } from 'node:fs';
import { degrees, PDFDocument, rgb, StandardFonts } from 'pdf-lib';
import { checkLift } from '@shared/engineering';
import type { StampInput } from '@server/modules/returns/stamp-pdf';

export const PLAN_ID = '11111111-1111-4111-8111-111111111111';
export const DRAWING_ID = '22222222-2222-4222-8222-222222222222';

/** The offset page's MediaBox origin. */
export const OFFSET_ORIGIN = { x: 50, y: 100 };

export async function planPdf(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setCreationDate(new Date('2027-03-01T00:00:00Z'));
  doc.setModificationDate(new Date('2027-03-01T00:00:00Z'));
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const p1 = doc.addPage([595.28, 841.89]);
  p1.drawText('LIFT PLAN - Northgate clarifier drive', { x: 40, y: 800, size: 14, font });
  p1.drawText('Crane position, exclusion zone and rigging arrangement', { x: 40, y: 780, size: 9, font });
  for (let i = 0; i < 12; i++)
    p1.drawLine({
      start: { x: 40, y: 120 + i * 50 },
      end: { x: 555, y: 120 + i * 50 },
      thickness: 0.5,
      color: rgb(0.6, 0.6, 0.6),
    });
  p1.drawRectangle({ x: 300, y: 300, width: 160, height: 90, borderColor: rgb(0, 0, 0), borderWidth: 1 });
  const p2 = doc.addPage([612, 792]);
  p2.setMediaBox(OFFSET_ORIGIN.x, OFFSET_ORIGIN.y, 612, 792);
  p2.drawText('Sheet 2 - ground bearing and mats', {
    x: OFFSET_ORIGIN.x + 40,
    y: OFFSET_ORIGIN.y + 750,
    size: 12,
    font,
  });
  return doc.save();
}

export async function drawingPdf(): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setCreationDate(new Date('2027-03-01T00:00:00Z'));
  doc.setModificationDate(new Date('2027-03-01T00:00:00Z'));
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const p = doc.addPage([420, 600]);
  p.setRotation(degrees(90));
  p.drawText('Rigging drawing RD-07', { x: 30, y: 560, size: 11, font });
  return doc.save();
}

export function exampleResult(name = 'caution-discrepancies', units: 'metric' | 'imperial' = 'metric') {
  const raw = JSON.parse(
    readFileSync(new URL(`../../shared/engineering/examples/${name}.json`, import.meta.url), 'utf8'),
  ) as Record<string, unknown>;
  const outcome = checkLift(raw, null, { units });
  if (!outcome.ok) throw new Error(`example ${name} does not check: ${JSON.stringify(outcome.issues)}`);
  return { inputs: raw, result: outcome.result };
}

/** Where the markups go; tests look for these exact coordinates. */
export const RECT = { x: 120, y: 420, width: 150, height: 80 };
export const OFFSET_RECT = { x: 100, y: 200, width: 60, height: 40 };

export async function stampInput(overrides: Partial<StampInput['stamp']> = {}): Promise<StampInput> {
  const { inputs, result } = exampleResult();
  return {
    documents: [
      { fileId: PLAN_ID, name: 'lift-plan.pdf', bytes: await planPdf() },
      { fileId: DRAWING_ID, name: 'rigging-drawing.pdf', bytes: await drawingPdf() },
    ],
    markups: [
      {
        fileId: PLAN_ID,
        pageNumber: 1,
        kind: 'rectangle',
        geometry: RECT,
        colour: 'rust',
        text: 'Mat size?',
        number: null,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 1,
        kind: 'ellipse',
        geometry: { x: 320, y: 520, width: 120, height: 60 },
        colour: 'cobalt',
        text: null,
        number: null,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 1,
        kind: 'cloud',
        geometry: { x: 60, y: 180, width: 200, height: 90 },
        colour: 'verdigris',
        text: 'Exclusion zone to be fenced',
        number: null,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 1,
        kind: 'arrow',
        geometry: { x1: 470, y1: 250, x2: 420, y2: 330 },
        colour: 'graphite',
        text: null,
        number: null,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 1,
        kind: 'text',
        geometry: { x: 60, y: 640, fontSize: 12 },
        colour: 'rust',
        text: 'Check sling angle ≥ 60° — see finding 1',
        number: null,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 1,
        kind: 'pin',
        geometry: { x: 460, y: 405 },
        colour: 'rust',
        text: null,
        number: 1,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 2,
        kind: 'rectangle',
        geometry: OFFSET_RECT,
        colour: 'cobalt',
        text: null,
        number: null,
      },
      {
        fileId: PLAN_ID,
        pageNumber: 2,
        kind: 'pin',
        geometry: { x: 300, y: 400 },
        colour: 'verdigris',
        text: null,
        number: 2,
      },
      {
        fileId: DRAWING_ID,
        pageNumber: 1,
        kind: 'pin',
        geometry: { x: 200, y: 300 },
        colour: 'rust',
        text: 'Shackle WLL',
        number: 3,
      },
      {
        fileId: DRAWING_ID,
        pageNumber: 1,
        kind: 'text',
        geometry: { x: 60, y: 100, fontSize: 10 },
        colour: 'cobalt',
        text: 'Upright on the turned page',
        number: null,
      },
    ],
    stamp: {
      decision: 'accepted_as_noted',
      reference: 'NGW-LP-0142',
      title: 'Northgate Water Treatment Works — set clarifier drive unit',
      revision: 2,
      site: 'Northgate Water Treatment Works',
      contractor: 'Harbour Row Crane Hire',
      engineer: 'Dr Imogen Reyes-Whitfield',
      reviewer: 'Tomasz Okafor',
      decidedAt: '2027-03-14T15:20:00Z',
      issuedAt: '2027-03-15T08:05:00Z',
      timeZone: 'Europe/London',
      conditions:
        'Lift only with wind below 9 m/s at the boom tip. Mats of 1.8 m × 1.8 m under every outrigger, not the 1.5 m mats shown. The lift director confirms the gross load on the load cell before the lift and stops if it reads above 10.6 t. Exclusion zone fenced and manned.',
      verificationCode: 'CP7K-Q2MX-94TD-R8VA',
      verificationUrl: 'https://counterpoise.example/verify/CP7K-Q2MX-94TD-R8VA',
      ...overrides,
    },
    calculation: {
      inputs,
      result,
      units: 'metric',
      findings: [
        {
          text: 'Stated gross load leaves out the spreader frame and the hook block.',
          severity: 'major',
          state: 'answered',
          response: 'Revised gross load 10.4 t on sheet 2.',
          checkId: 'gross-load',
          pageNumber: 1,
        },
        {
          text: 'Show the exclusion zone fencing on the plan.',
          severity: 'minor',
          state: 'open',
          response: null,
          checkId: null,
          pageNumber: 1,
        },
      ],
      acceptedFigures: [],
    },
  };
}
