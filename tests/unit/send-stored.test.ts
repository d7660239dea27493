// What the shared download helper makes of a Range header, before any byte is read.
import { describe, expect, it } from 'vitest';
import { decideRange } from '@server/lib/send-stored';

describe('decideRange', () => {
  it('when there is no Range, then the whole file (200)', () => {
    expect(decideRange(5000, undefined)).toEqual({ status: 200 });
  });

  it('when one range is asked for, then 206 with inclusive offsets, a too-long end cut to the file', () => {
    expect(decideRange(5000, 'bytes=0-1023')).toEqual({ status: 206, range: { start: 0, end: 1023 } });
    expect(decideRange(5000, 'bytes=4000-')).toEqual({ status: 206, range: { start: 4000, end: 4999 } });
    expect(decideRange(5000, 'bytes=-500')).toEqual({ status: 206, range: { start: 4500, end: 4999 } });
    expect(decideRange(5000, 'bytes=4990-9999')).toEqual({ status: 206, range: { start: 4990, end: 4999 } });
  });

  it('when the range starts past the end, or the file is empty, then 416', () => {
    expect(decideRange(5000, 'bytes=5000-')).toEqual({ status: 416 });
    expect(decideRange(0, 'bytes=0-10')).toEqual({ status: 416 });
  });

  it('when ranges overlap, then they are served as the one range they make', () => {
    expect(decideRange(5000, 'bytes=0-99,50-199')).toEqual({ status: 206, range: { start: 0, end: 199 } });
  });

  it('when several separate ranges, another unit or a malformed header is sent, then the whole file', () => {
    expect(decideRange(5000, 'bytes=0-9,100-109')).toEqual({ status: 200 });
    expect(decideRange(5000, 'pages=1-2')).toEqual({ status: 200 });
    expect(decideRange(5000, 'bytes=abc')).toEqual({ status: 200 });
  });
});
