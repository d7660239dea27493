// The desk's signing identity and the CMS signature of a stamped return.
//
// The certificate and key come from a PKCS#12 file: the one given by SIGNING_P12_FILE and
// SIGNING_P12_PASSPHRASE (a certificate from a real authority), or else the desk's own,
// made on first start as DATA_DIR/desk-signing.p12 with a random passphrase beside it in
// DATA_DIR/desk-signing.pass. node-forge reads and writes the PKCS#12 (once, at start).
//
// The signature is a CMS SignedData built with pkijs (PAdES baseline B: detached, signed
// attributes content-type, message-digest and signing-certificate-v2, no signing-time, the
// time being the signature dictionary's /M). The digest of the document is computed outside
// (a streaming sha-256 over the file's byte ranges), so the document never passes through
// JavaScript; pkijs signs only the signed attributes, with Node's WebCrypto.
import { createHash, generateKeyPairSync, randomBytes, webcrypto } from 'node:crypto';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import * as asn1js from 'asn1js';
import forge from 'node-forge';
import * as pkijs from 'pkijs';

export interface Signer {
  /** SHA-256 of the signing certificate's DER, lower-case hex. */
  fingerprint: string;
  /** The certificate's subject common name. */
  subject: string;
  /** A detached CMS SignedData over a document whose sha-256 is `digest`. */
  sign(digest: Buffer): Promise<Buffer>;
  /** Bytes one signature takes (measured once), so the placeholder is no larger than needed. */
  signatureSize: number;
}

export class SigningSetupError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SigningSetupError';
  }
}

const OID = {
  data: '1.2.840.113549.1.7.1',
  signedData: '1.2.840.113549.1.7.2',
  contentType: '1.2.840.113549.1.9.3',
  messageDigest: '1.2.840.113549.1.9.4',
  signingCertificateV2: '1.2.840.113549.1.9.16.2.47',
};

let engineSet = false;
function engine() {
  if (!engineSet) {
    pkijs.setEngine('node', new pkijs.CryptoEngine({ name: 'node', crypto: webcrypto as unknown as Crypto }));
    engineSet = true;
  }
}

function toArrayBuffer(b: Uint8Array): ArrayBuffer {
  return b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength) as ArrayBuffer;
}

/** Build a signer from a certificate chain (signing certificate first) and its PKCS#8 key. */
export async function signerFrom(certsDer: Buffer[], keyPkcs8: Buffer): Promise<Signer> {
  engine();
  const certs = certsDer.map((d) => pkijs.Certificate.fromBER(toArrayBuffer(d)));
  const cert = certs[0];
  const key = await webcrypto.subtle.importKey(
    'pkcs8',
    toArrayBuffer(keyPkcs8),
    { name: 'RSASSA-PKCS1-v1_5', hash: 'SHA-256' },
    false,
    ['sign'],
  );
  const certHash = createHash('sha256').update(certsDer[0]).digest();
  const cn = cert.subject.typesAndValues.find((t) => t.type === '2.5.4.3');
  const subject = cn ? String(cn.value.valueBlock.value) : 'Counterpoise lift desk';
  // SigningCertificateV2 ::= SEQUENCE { certs SEQUENCE OF ESSCertIDv2 } (RFC 5035); the hash
  // algorithm is SHA-256, the default, so it is left out as DER requires.
  const essCertIdV2 = new asn1js.Sequence({
    value: [new asn1js.Sequence({ value: [new asn1js.OctetString({ valueHex: toArrayBuffer(certHash) })] })],
  });
  const signer = {
    fingerprint: certHash.toString('hex'),
    subject,
    signatureSize: 0,
    async sign(digest: Buffer) {
      const signedData = new pkijs.SignedData({
        version: 1,
        encapContentInfo: new pkijs.EncapsulatedContentInfo({ eContentType: OID.data }),
        signerInfos: [
          new pkijs.SignerInfo({
            version: 1,
            sid: new pkijs.IssuerAndSerialNumber({ issuer: cert.issuer, serialNumber: cert.serialNumber }),
            signedAttrs: new pkijs.SignedAndUnsignedAttributes({
              type: 0,
              attributes: [
                new pkijs.Attribute({
                  type: OID.contentType,
                  values: [new asn1js.ObjectIdentifier({ value: OID.data })],
                }),
                new pkijs.Attribute({
                  type: OID.messageDigest,
                  values: [new asn1js.OctetString({ valueHex: toArrayBuffer(digest) })],
                }),
                new pkijs.Attribute({ type: OID.signingCertificateV2, values: [essCertIdV2] }),
              ],
            }),
          }),
        ],
        certificates: certs,
      });
      await signedData.sign(key, 0, 'SHA-256');
      const info = new pkijs.ContentInfo({ contentType: OID.signedData, content: signedData.toSchema(true) });
      return Buffer.from(info.toSchema().toBER(false));
    },
  };
  signer.signatureSize = (await signer.sign(Buffer.alloc(32))).length;
  return signer;
}

/** Read a PKCS#12 file: the key and the certificate it belongs to, then the rest of the chain. */
export async function signerFromP12(file: string, passphrase: string): Promise<Signer> {
  let p12: forge.pkcs12.Pkcs12Pfx;
  try {
    const der = readFileSync(file).toString('binary');
    p12 = forge.pkcs12.pkcs12FromAsn1(forge.asn1.fromDer(der), passphrase);
  } catch (err) {
    throw new SigningSetupError(
      `SIGNING_P12_FILE ${path.basename(file)} could not be opened with SIGNING_P12_PASSPHRASE (${
        err instanceof Error ? err.message : String(err)
      }).`,
    );
  }
  const keyBag =
    p12.getBags({ bagType: forge.pki.oids.pkcs8ShroudedKeyBag })[forge.pki.oids.pkcs8ShroudedKeyBag]?.[0] ??
    p12.getBags({ bagType: forge.pki.oids.keyBag })[forge.pki.oids.keyBag]?.[0];
  const certBags = p12.getBags({ bagType: forge.pki.oids.certBag })[forge.pki.oids.certBag] ?? [];
  if (!keyBag?.key || certBags.length === 0)
    throw new SigningSetupError(
      `SIGNING_P12_FILE ${path.basename(file)} holds no private key with its certificate.`,
    );
  const key = keyBag.key as forge.pki.rsa.PrivateKey;
  const certs = certBags.map((b) => b.cert!).filter(Boolean);
  const own = certs.findIndex(
    (c) => (c.publicKey as forge.pki.rsa.PublicKey).n.compareTo((key as forge.pki.rsa.PrivateKey).n) === 0,
  );
  if (own < 0)
    throw new SigningSetupError(`SIGNING_P12_FILE ${path.basename(file)}: no certificate matches its key.`);
  const ordered = [certs[own], ...certs.filter((_, i) => i !== own)];
  const der = (c: forge.pki.Certificate) =>
    Buffer.from(forge.asn1.toDer(forge.pki.certificateToAsn1(c)).getBytes(), 'binary');
  const pkcs8 = Buffer.from(
    forge.asn1.toDer(forge.pki.wrapRsaPrivateKey(forge.pki.privateKeyToAsn1(key))).getBytes(),
    'binary',
  );
  return signerFrom(ordered.map(der), pkcs8);
}

/** Make the desk's own self-signed certificate and key as a PKCS#12 file. */
export function createDeskP12(file: string, passphrase: string, commonName: string) {
  // Node makes the RSA key natively (forge would take seconds in JavaScript).
  const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 3072 });
  const key = forge.pki.privateKeyFromPem(privateKey.export({ type: 'pkcs1', format: 'pem' }).toString());
  const pub = forge.pki.setRsaPublicKey(key.n, key.e);
  const cert = forge.pki.createCertificate();
  cert.publicKey = pub;
  cert.serialNumber = '01' + randomBytes(15).toString('hex');
  const now = new Date();
  cert.validity.notBefore = new Date(now.getTime() - 60_000);
  cert.validity.notAfter = new Date(now.getTime() + 10 * 365.25 * 86_400_000);
  const attrs = [
    { name: 'commonName', value: commonName },
    { name: 'organizationName', value: 'Counterpoise review desk' },
  ];
  cert.setSubject(attrs);
  cert.setIssuer(attrs);
  cert.setExtensions([
    { name: 'basicConstraints', cA: false },
    { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
    { name: 'subjectKeyIdentifier' },
  ]);
  cert.sign(key, forge.md.sha256.create());
  const asn1 = forge.pkcs12.toPkcs12Asn1(key, [cert], passphrase, {
    algorithm: 'aes256',
    friendlyName: commonName,
  });
  mkdirSync(path.dirname(file), { recursive: true });
  writeFileSync(file, Buffer.from(forge.asn1.toDer(asn1).getBytes(), 'binary'), { mode: 0o600 });
}

export interface SigningSettings {
  DATA_DIR: string;
  SIGNING_P12_FILE?: string;
  SIGNING_P12_PASSPHRASE?: string;
}

/**
 * The configured signer, or the desk's own (made on first use). A configured file without its
 * passphrase is a configuration error that config.ts reports before this runs.
 */
export async function loadSigner(settings: SigningSettings): Promise<Signer> {
  if (settings.SIGNING_P12_FILE) {
    if (!settings.SIGNING_P12_PASSPHRASE)
      throw new SigningSetupError(
        'SIGNING_P12_PASSPHRASE must be set to the passphrase of the PKCS#12 file named by SIGNING_P12_FILE.',
      );
    if (!existsSync(settings.SIGNING_P12_FILE))
      throw new SigningSetupError(`SIGNING_P12_FILE names a file that does not exist.`);
    return signerFromP12(settings.SIGNING_P12_FILE, settings.SIGNING_P12_PASSPHRASE);
  }
  const file = path.join(settings.DATA_DIR, 'desk-signing.p12');
  const passFile = path.join(settings.DATA_DIR, 'desk-signing.pass');
  if (!existsSync(file) || !existsSync(passFile)) {
    const passphrase = randomBytes(24).toString('base64url');
    createDeskP12(file, passphrase, 'Counterpoise lift desk');
    writeFileSync(passFile, passphrase, { mode: 0o600 });
    chmodSync(passFile, 0o600);
  }
  return signerFromP12(file, readFileSync(passFile, 'utf8').trim());
}

const cache = new Map<string, Promise<Signer>>();

/** One signer per set of settings and process: the PKCS#12 is read once. */
export function signerFor(settings: SigningSettings): Promise<Signer> {
  const key = `${settings.DATA_DIR}\0${settings.SIGNING_P12_FILE ?? ''}`;
  let s = cache.get(key);
  if (!s) {
    s = loadSigner(settings);
    s.catch(() => cache.delete(key));
    cache.set(key, s);
  }
  return s;
}
