// Validation messages in a person's words, and the detector the screen, PDF and mail tests use.
import { describe, expect, it } from 'vitest';
import { LiftInput } from '@shared/schemas/lift-input';
import { readableError, readableIssue } from '@shared/catalogue/readable-issue';
import { internalWords } from '../support/internal-words';

describe('readableIssue', () => {
  it('when a schema message names the field by its path, then it names it by the label', () => {
    expect(readableIssue('inputs.crane.boomLength.value', 'crane.boomLength must be greater than 0')).toBe(
      'Boom length must be greater than 0',
    );
    expect(readableIssue('plannedLiftDate', 'plannedLiftDate must be a date (YYYY-MM-DD)')).toBe(
      'Planned lift date must be a date (YYYY-MM-DD)',
    );
  });

  it("when zod's own wording comes through, then it reads as a sentence", () => {
    expect(readableIssue('load.weight', 'Invalid input: expected object, received undefined')).toBe(
      'Load weight is required',
    );
    expect(readableIssue('title', 'Too big: expected string to have <=200 characters')).toBe(
      'Title must be at most 200 characters',
    );
    expect(
      readableIssue('crane.type', 'Invalid option: expected one of "mobile_outriggers"|"mobile_crawler"'),
    ).toBe('Crane type must be one of the choices offered');
  });

  it('when a file name is in the message, then it stays as written', () => {
    expect(readableIssue('file', 'rigging-drawing.pdf could not be read')).toBe(
      'File: rigging-drawing.pdf could not be read',
    );
  });

  it('when a message is already in words, then it is left alone (applying twice changes nothing)', () => {
    const once = readableIssue('crane.boomLength', 'crane.boomLength must be greater than 0');
    expect(readableIssue('crane.boomLength', once)).toBe(once);
  });

  it('when every issue of an empty and a broken lift is worded, then no code name or zod wording is left', () => {
    const broken = {
      crane: { type: 'mobile_outriggers', boomLength: { value: -1, unit: 'm' }, upper: { weight: 'x' } },
      load: {},
      multiCrane: { others: [{}] },
      rigging: { slings: { legs: [{ angle: { value: 120, unit: 'deg' } }] } },
    };
    for (const input of [{}, broken]) {
      const parsed = LiftInput.safeParse(input);
      expect(parsed.success).toBe(false);
      for (const issue of parsed.error!.issues) {
        const path = issue.path.map(String).join('.');
        const { message, fields } = readableError(`${path}: ${issue.message}`, [
          { path, message: issue.message },
        ]);
        expect(internalWords(`${message}\n${fields![0].message}`), `${path}: ${issue.message}`).toEqual([]);
      }
    }
  });
});

describe('internalWords', () => {
  it('when code names, prefixed ids or zod wording appear, then each is reported', () => {
    expect(
      internalWords('Hazard overOperatingPlant, status with_engineer, stated:chartCapacity. Invalid input'),
    ).toEqual([
      'camelCase name: overOperatingPlant',
      'camelCase name: chartCapacity',
      'snake_case name: with_engineer',
      'prefixed id: stated:chartCapacity',
      'zod wording: Invalid input',
    ]);
  });

  it('when the text has units, addresses and file names only, then nothing is reported', () => {
    expect(
      internalWords('Ground 180 kPa, 45 kN·m; mail dev_marsh@example.test; https://a.test/x_y; plan_v2.pdf'),
    ).toEqual([]);
  });
});
