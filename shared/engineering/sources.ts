// Where each limit comes from, in one place so the text is the same in every check, the admin page
// and the calculation sheet. Kinds: a named standard (read in a public copy), the site policy,
// common practice with no source, or "from memory" (not checked against the source).
import type { Source, UnitSystem } from './types';

const std = (text: string): Source => ({ kind: 'standard', text });

/** A source whose text names quantities: the text in each unit system (`text` keeps both). */
const inUnits = (source: Source, metric: string, imperial: string): Source => ({
  ...source,
  textIn: { metric, imperial },
});

/** A source's text as a document in `system` prints it. */
export function sourceText(source: Source, system: UnitSystem): string {
  return source.textIn?.[system] ?? source.text;
}

export const SOURCES = {
  oshaTableA: std('OSHA 29 CFR 1926.1408, Table A (minimum clearance distances)'),
  oshaNearLines: inUnits(
    {
      kind: 'from_memory',
      text: 'OSHA 29 CFR 1926.1408(a) and 1926.1409: work zone within 20 ft (up to 350 kV) or 50 ft (over 350 kV) of a line (from memory)',
    },
    'OSHA 29 CFR 1926.1408(a) and 1926.1409: work zone within 6.10 m (up to 350 kV) or 15.2 m (over 350 kV) of a line (from memory)',
    'OSHA 29 CFR 1926.1408(a) and 1926.1409: work zone within 20 ft (up to 350 kV) or 50 ft (over 350 kV) of a line (from memory)',
  ),
  oshaPersonnel: std('OSHA 29 CFR 1926.1431 (hoisting personnel: 50% of rated capacity)'),
  oshaPersonnelWind: inUnits(
    std('OSHA 29 CFR 1926.1431 (above 20 mph a qualified person decides whether to lift)'),
    'OSHA 29 CFR 1926.1431 (above 8.94 m/s a qualified person decides whether to lift)',
    'OSHA 29 CFR 1926.1431 (above 20 mph a qualified person decides whether to lift)',
  ),
  asmeTipping: std(
    'ASME B30.5 §5-1.1.1 / SAE J765: rated load ≤ 85% of tipping load on outriggers, 75% on crawlers',
  ),
  asmeBackward: {
    kind: 'from_memory',
    text: 'ASME B30.5 §5-1.1.2 backward stability (from memory: crawlers, CG within 70% of the distance to the backward fulcrum; outriggers or wheels, at least 15% of the weight on the boom-side supports); the same test read in ASME B30.4-2020 §4-1.3.4',
  } as Source,
  slingAngle: std('Rigging handbooks, ASME B30.9 practice: leg tension = share ÷ sin(angle from horizontal)'),
  slingMinAngle: std('Rigging handbooks: leg angles below 30° from horizontal are not used'),
  chokerWire: std(
    'Rigging handbooks: choker hitch ≈ 75% of vertical rating for wire rope (choke angle ≥ 120°)',
  ),
  chokerSynthetic: {
    kind: 'from_memory',
    text: 'Choker hitch 80% of vertical rating for synthetic slings (from memory)',
  } as Source,
  chokerChain: {
    kind: 'from_memory',
    text: 'Choker hitch 80% of vertical rating for chain slings (from memory)',
  } as Source,
  chokeAngle: std(
    'ASME B30.9 choke-angle table (read as reproduced in sling makers’ instructions): choker rating × 1.00 over 120°, 0.87 at 90–120°, 0.74 at 60–89°, 0.62 at 30–59°, 0.49 at 0–29°',
  ),
  bridleStatics: std(
    'Statics of the hook: leg tension T = V · L / h, vertical shares from force and moment balance about the centre of gravity',
  ),
  bridleTwoLegs: {
    kind: 'from_memory',
    text: 'ASME B30.9: a four-leg bridle is rated as if two legs carry the load unless an equalising arrangement is used (from memory)',
  } as Source,
  bridleEqualised: {
    kind: 'common_practice',
    text: 'Equalised four-leg bridle: the balanced shares nearest to equal (common practice, no source)',
  } as Source,
  verticalShare: std('Statics: the vertical share of a leg = its tension × sin(angle from horizontal)'),
  beamDrops: std(
    'Statics of a beam on two drops (lever rule): each drop carries W × the other drop’s distance from the centre of gravity ÷ the drop spacing',
  ),
  trackMats: {
    kind: 'common_practice',
    text: 'Rigid mats under a crawler track spread its pressure across the mat length (common practice, no source)',
  } as Source,
  basket: std('Rigging handbooks: basket hitch with vertical legs = 2 × vertical rating'),
  ibc1806: std('International Building Code Table 1806.2 (2012), presumptive load-bearing values'),
  wrumSheave: std(
    'Wire Rope Users Manual, 4th ed.: sheave bearing constant 1.09 plain (bronze-bushed), 1.04 roller',
  ),
  wrumFormula: {
    kind: 'from_memory',
    text: 'Lead-line factor K^S(K−1)/(K^N−1) (from memory; reproduces the Wire Rope Users Manual tabulated values)',
  } as Source,
  ropeRunning: std('ASME B30.6 / B30.22 (B30.5 from memory): design factor 3.5 for running rope'),
  ropeRotationResistant: std(
    'ASME B30.6 / B30.22 (B30.5 from memory): design factor 5 for rotation-resistant rope',
  ),
  windPressure: inUnits(
    std('Dynamic pressure q = ½ρv², ρ = 1.225 kg/m³ (q = 0.613 v² Pa; 0.00256 V² psf)'),
    'Dynamic pressure q = ½ρv², ρ = 1.225 kg/m³ (q = 0.613 v² Pa, v in m/s)',
    'Dynamic pressure q = ½ρv² (q = 0.00256 V² psf, V in mph; air at sea level)',
  ),
  queenslandTandem: std('Queensland Mobile Crane Code of Practice 2006 §14.3.2 (tandem margins 20/33/50%)'),
  tandemShare: std('Load sharing, hoist lines plumb: share A = W · d_B / (d_A + d_B)'),
  usaceCritical: std('USACE EM 385-1-1 §16.H (critical lift criteria)'),
  doeCritical: std('DOE-STD-1090 (critical lift by consequence)'),
  chartRule: {
    kind: 'common_practice',
    text: 'Common practice, no source: never interpolate a load chart upward',
  } as Source,
  rigidBase: {
    kind: 'common_practice',
    text: 'Statics of a rigid base on four supports of equal stiffness (common practice, no source)',
  } as Source,
  eccentricFooting: {
    kind: 'common_practice',
    text: 'Eccentric footing, the track taken as rigid: trapezoidal pressure when e ≤ L/6, triangular when e > L/6 (statics; common practice, no source)',
  } as Source,
  statics: { kind: 'computed', text: 'Statics (moment = force × lever arm)' } as Source,
  gantryBackward: {
    kind: 'common_practice',
    text: 'A backstay carries tension only: unloaded, the frame must still lean on it (statics; common practice, no source)',
  } as Source,
  input: { kind: 'input', text: 'as entered' } as Source,
  manufacturerChart: { kind: 'input', text: "Manufacturer's load chart rows as entered" } as Source,
  policy: (what: string, inSystems?: Record<UnitSystem, string>): Source => ({
    kind: 'site_policy',
    text: `site policy: ${what}`,
    ...(inSystems && {
      textIn: { metric: `site policy: ${inSystems.metric}`, imperial: `site policy: ${inSystems.imperial}` },
    }),
  }),
};
