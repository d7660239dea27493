// The local fake S3 server as its own process (started by the start command when S3_ENDPOINT
// is not set), its objects under DATA_DIR/s3.
import { fakeS3Settings } from './config';
import { startFakeS3 } from './lib/fake-s3';
import { logger } from './lib/logger';

async function main() {
  const fake = await startFakeS3(fakeS3Settings());
  logger.info({ url: fake.url }, 'local fake S3 server listening');
  const stop = async () => {
    await fake.close().catch(() => undefined);
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop());
  process.on('SIGINT', () => void stop());
}

main().catch((error) => {
  process.stderr.write(`[s3-fake] could not start: ${(error as Error).message}\n`);
  process.exit(1);
});
