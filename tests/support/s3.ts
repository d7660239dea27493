// What the bucket holds under a prefix, listed through the S3 API (the tests' view of the
// stored files, where they once listed a folder).
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import type { Config } from '@server/config';
import { createS3Client } from '@server/lib/s3-storage';

/** The names (the part after `prefix`) of the objects stored under it. */
export async function storedObjects(config: Config, prefix: string): Promise<string[]> {
  const client = createS3Client(config);
  try {
    const names: string[] = [];
    let token: string | undefined;
    do {
      const page = await client.send(
        new ListObjectsV2Command({ Bucket: config.S3_BUCKET, Prefix: prefix, ContinuationToken: token }),
      );
      for (const o of page.Contents ?? []) if (o.Key) names.push(o.Key.slice(prefix.length));
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
    return names.sort();
  } finally {
    client.destroy();
  }
}
