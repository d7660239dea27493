// The signed return read back by independent tools: qpdf for the originals' streams (their
// raw bytes, hashed) and the page order, poppler's pdfsig for the signature.
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadSigner, type Signer } from '@server/lib/pdf-tools/signer';
import { buildStampedReturn, StampInputError, type StampInput } from '@server/modules/returns/stamp-pdf';
import { stampInput } from './stamp-fixtures';

const dir = mkdtempSync(join(tmpdir(), 'cp-sign-test-'));
let signer: Signer;
let input: StampInput;
let signed: Uint8Array;
const returnFile = join(dir, 'return.pdf');

interface QJson {
  pages: Array<{ object: string; contents: string[]; images: Array<{ object: string }> }>;
}

function pagesOf(file: string): QJson['pages'] {
  // spawns: qpdf
  const out = execFileSync('qpdf', ['--json=2', '--json-key=pages', file], { encoding: 'utf8' });
  return (JSON.parse(out) as QJson).pages;
}

/** sha-256 of a stream object's raw (still encoded) data, read by qpdf. */
function rawStreamHash(file: string, ref: string): string {
  const num = ref.split(' ')[0];
  const bytes = execFileSync('qpdf', [`--show-object=${num}`, '--raw-stream-data', file], {
    maxBuffer: 256 * 1024 * 1024,
  });
  return createHash('sha256').update(bytes).digest('hex');
}

function pdfsig(file: string): string {
  // spawns: pdfsig
  const r = spawnSync('pdfsig', [file], { encoding: 'utf8' });
  return `${r.stdout}\n${r.stderr}`;
}

beforeAll(async () => {
  signer = await loadSigner({ DATA_DIR: join(dir, 'data') });
  input = await stampInput();
  signed = await buildStampedReturn(input, { signer });
  writeFileSync(returnFile, signed);
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('signed stamped return', () => {
  it("when the return is read with qpdf, then every original page's content and image streams are byte for byte the uploaded ones, in order", () => {
    const originals = input.documents.flatMap((d, i) => {
      const f = join(dir, `original-${i}.pdf`);
      writeFileSync(f, d.bytes!);
      return pagesOf(f).map((p) => ({
        contents: p.contents.map((c) => rawStreamHash(f, c)),
        images: p.images.map((im) => rawStreamHash(f, im.object)),
      }));
    });
    const pages = pagesOf(returnFile);
    expect(pages.length).toBeGreaterThan(originals.length);
    originals.forEach((o, i) => {
      // [q, the page's own streams…, Q + the overlay]
      const contents = pages[i].contents.map((c) => rawStreamHash(returnFile, c));
      expect(contents.slice(1, 1 + o.contents.length)).toEqual(o.contents);
      expect(contents).toHaveLength(o.contents.length + 2);
      expect(pages[i].images.map((im) => rawStreamHash(returnFile, im.object))).toEqual(
        expect.arrayContaining(o.images),
      );
    });
  });

  it('when pdfsig checks the return, then the signature is valid and covers the whole document', () => {
    const report = pdfsig(returnFile);
    expect(report).toContain('Signature is Valid');
    expect(report).toContain('Total document signed');
    expect(report).toContain('ETSI.CAdES.detached');
    expect(report).toContain('Counterpoise lift desk');
  });

  it('when one byte of the signed return is changed, then pdfsig reports the signature broken', () => {
    const tampered = Buffer.from(signed);
    // One byte of the first original page's own content stream (inside the signed range).
    const own = pagesOf(returnFile)[0].contents[1].split(' ')[0];
    const obj = tampered.indexOf(`\n${own} 0 obj`);
    expect(obj).toBeGreaterThan(0);
    const at = tampered.indexOf('stream\n', obj) + 'stream\n'.length + 5;
    tampered[at] ^= 0x01;
    const file = join(dir, 'tampered.pdf');
    writeFileSync(file, tampered);
    const report = pdfsig(file);
    expect(report).not.toContain('Signature is Valid');
    expect(report).toMatch(/Signature is Invalid|Digest Mismatch|not valid/i);
  });

  it('when the signer is read, then its fingerprint is the sha-256 of the certificate in the signature', () => {
    expect(signer.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    // The CMS carries the certificate: its DER bytes are in the return.
    const hex = Buffer.from(signed).toString('latin1');
    expect(hex).toContain('/SubFilter /ETSI.CAdES.detached');
  });

  it('when a document is damaged, then the build is refused with qpdf’s message naming the file', async () => {
    const bad = await stampInput();
    const bytes = Buffer.from(bad.documents[1].bytes!);
    bad.documents[1] = { ...bad.documents[1], bytes: new Uint8Array(bytes.subarray(0, 200)) };
    const err = await buildStampedReturn(bad, { signer }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(StampInputError);
    expect((err as Error).message).toMatch(/^rigging-drawing\.pdf could not be read as a PDF \(.+\)\.$/);
    expect((err as Error).message).not.toMatch(/\n|at .*\.ts/);
  });

  it('when the desk certificate exists, then a second start reads the same one', async () => {
    const again = await loadSigner({ DATA_DIR: join(dir, 'data') });
    expect(again.fingerprint).toBe(signer.fingerprint);
  });

  it('when a PKCS#12 file is configured with a wrong passphrase, then the error names the setting', async () => {
    const err = await loadSigner({
      DATA_DIR: dir,
      SIGNING_P12_FILE: join(dir, 'data', 'desk-signing.p12'),
      SIGNING_P12_PASSPHRASE: 'not-the-passphrase',
    }).catch((e: unknown) => e);
    expect((err as Error).message).toMatch(/SIGNING_P12_PASSPHRASE/);
  });

  it('when a PKCS#12 file is configured with its passphrase, then it signs with that certificate', async () => {
    const pass = readFileSync(join(dir, 'data', 'desk-signing.pass'), 'utf8');
    const configured = await loadSigner({
      DATA_DIR: join(dir, 'elsewhere'),
      SIGNING_P12_FILE: join(dir, 'data', 'desk-signing.p12'),
      SIGNING_P12_PASSPHRASE: pass,
    });
    expect(configured.fingerprint).toBe(signer.fingerprint);
  });
});

describe('signing settings', () => {
  it('when SIGNING_P12_FILE is set without SIGNING_P12_PASSPHRASE, then the configuration stops with one sentence naming it', async () => {
    const { loadConfig } = await import('@server/config');
    const env = {
      DATABASE_URL: 'postgres://app@127.0.0.1:1/x',
      REDIS_URL: 'redis://127.0.0.1:1',
      JWT_SECRET: 'x'.repeat(32),
      S3_BUCKET: 'counterpoise',
      SIGNING_P12_FILE: join(dir, 'authority.p12'),
    };
    expect(() => loadConfig(env)).toThrow(
      /SIGNING_P12_PASSPHRASE: SIGNING_P12_PASSPHRASE must be set to the passphrase of the PKCS#12 file that SIGNING_P12_FILE names/,
    );
    expect(() => loadConfig({ ...env, SIGNING_P12_PASSPHRASE: 'secret' })).not.toThrow();
  });
});

describe('signed return file', () => {
  it('when a signed return is built to a file, then the sha-256 it reports is that of the file', async () => {
    const { buildStampedReturnFile } = await import('@server/modules/returns/stamp-pdf');
    const out = join(dir, 'to-file.pdf');
    const built = await buildStampedReturnFile(await stampInput(), out, { signer, workDir: dir });
    expect(built.sha256).toBe(createHash('sha256').update(readFileSync(out)).digest('hex'));
    expect(built.signingCertificateSha256).toBe(signer.fingerprint);
    expect(pdfsig(out)).toContain('Signature is Valid');
  });
});
