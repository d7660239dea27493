// The S3 settings read from the environment: the defaults for the local fake, and the
// errors naming the variable when a value cannot work.
import { describe, expect, it } from 'vitest';
import { s3Settings } from '@server/config';

describe('S3 settings', () => {
  it('when only the bucket is set, then the region is us-east-1, path style on, and no endpoint or keys', () => {
    expect(s3Settings({ S3_BUCKET: 'counterpoise' })).toEqual({
      S3_BUCKET: 'counterpoise',
      S3_REGION: 'us-east-1',
      S3_FORCE_PATH_STYLE: true,
    });
  });

  it('when S3_FORCE_PATH_STYLE is false, then virtual-hosted buckets are used', () => {
    expect(s3Settings({ S3_BUCKET: 'abc', S3_FORCE_PATH_STYLE: 'false' }).S3_FORCE_PATH_STYLE).toBe(false);
  });

  it('when the bucket is missing, then the error names S3_BUCKET and who sets it', () => {
    expect(() => s3Settings({})).toThrow(
      /S3_BUCKET: S3_BUCKET is required \(the start command sets it for the local fake S3 server\)/,
    );
  });

  it('when the bucket name is not one S3 accepts, then the error says what a name may hold', () => {
    expect(() => s3Settings({ S3_BUCKET: 'No_Such' })).toThrow(
      /S3_BUCKET must be 3 to 63 of a-z, 0-9, \. and -/,
    );
  });

  it('when only one of the two keys is set, then the error names the missing one', () => {
    expect(() => s3Settings({ S3_BUCKET: 'abc', S3_ACCESS_KEY_ID: 'id' })).toThrow(
      /S3_SECRET_ACCESS_KEY: S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY are set together, or neither/,
    );
  });

  it('when the endpoint is not a URL, then the error shows one', () => {
    expect(() => s3Settings({ S3_BUCKET: 'abc', S3_ENDPOINT: 'localhost:9000' })).toThrow(
      /S3_ENDPOINT: S3_ENDPOINT must be a URL such as http:\/\/127\.0\.0\.1:59000/,
    );
  });

  it('when path style is neither true nor false, then the error says so', () => {
    expect(() => s3Settings({ S3_BUCKET: 'abc', S3_FORCE_PATH_STYLE: 'yes' })).toThrow(
      /S3_FORCE_PATH_STYLE: must be true or false/,
    );
  });
});
