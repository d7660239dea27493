// What the stamped return is built from (stamp-pdf.ts builds it; the calculation sheet reads the
// stamp and calculation parts). Its own module so that the sheet and the stamp do not import each other.
import type { LiftResult } from '@shared/engineering/types';

export type MarkupKind = 'rectangle' | 'ellipse' | 'cloud' | 'arrow' | 'text' | 'pin';

export interface StampInput {
  /** The lift plan first, then the supporting PDFs: a file on disk, or bytes (tests). */
  documents: Array<{ fileId: string; name: string; file?: string; bytes?: Uint8Array }>;
  markups: Array<{
    fileId: string;
    pageNumber: number;
    kind: MarkupKind;
    geometry: Record<string, number>;
    colour: 'rust' | 'cobalt' | 'verdigris' | 'graphite';
    text: string | null;
    number: number | null;
    /** The findings tied to this markup, numbered as the calculation sheet lists them ("F3"). */
    findings?: string[];
  }>;
  stamp: {
    decision: 'accepted' | 'accepted_as_noted' | 'revise_and_resubmit' | 'rejected';
    reference: string;
    title: string;
    revision: number;
    site: string;
    contractor: string;
    engineer: string;
    reviewer: string;
    /** ISO date-times. */
    decidedAt: string;
    issuedAt: string;
    timeZone: string;
    conditions: string;
    /** Why an acceptance stands although the items in `overridden` stood against it (none: absent). */
    overrideReason?: string | null;
    overridden?: string[];
    verificationCode: string;
    verificationUrl: string;
  };
  calculation: {
    /** The raw LiftInput JSON. */
    inputs: Record<string, unknown>;
    result: LiftResult | null;
    units: 'metric' | 'imperial';
    findings: Array<{
      /** "F3": the finding's number, also drawn by its markup. */
      label?: string;
      /** Where its markup is, in words ("Page 3 of the return (plan.pdf, page 1), cloud marked F3"). */
      markup?: string | null;
      /** The page of the return `markup` names, counted without a cover sheet. */
      markupPage?: number | null;
      text: string;
      severity: string;
      state: string;
      response: string | null;
      checkId: string | null;
      pageNumber: number | null;
    }>;
    acceptedFigures: Array<{ figure: string; reason: string; engineer: string }>;
  };
  /**
   * The engineer's placement of the stamp block on page 1 of the plan: the lower-left corner of
   * its outline in the page's display frame (points, y up). Null: the desk picks the emptiest corner.
   */
  placement?: { x: number; y: number } | null;
}
