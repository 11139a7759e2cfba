import { randomBytes } from 'node:crypto'
import { chmod, mkdir, readFile, writeFile } from 'node:fs/promises'
import { existsSync } from 'node:fs'
import { join } from 'node:path'
import forge from 'node-forge'

/** The permit-signing identity: a PKCS#12 bundle and its passphrase. */
export interface SigningKey {
  p12: Buffer
  passphrase: string
  /** SHA-256 fingerprint of the certificate, hex, for the verification page. */
  certificateSha256: string
  /** The certificate in PEM, for anyone who wants to check signatures with their own tools. */
  certificatePem: string
}

const P12_FILE = 'permit-signing.p12'
const PASS_FILE = 'permit-signing.pass'
const CERT_FILE = 'permit-signing.crt.pem'

function fingerprint(pem: string): string {
  const cert = forge.pki.certificateFromPem(pem)
  const der = forge.asn1.toDer(forge.pki.certificateToAsn1(cert)).getBytes()
  return forge.md.sha256.create().update(der).digest().toHex()
}

/**
 * Load the signing key from `dir`, creating it on first use: an RSA-2048 key with a self-signed
 * certificate valid for ten years, written with mode 600 outside the repository (the data
 * folder). A deployment that has a certificate from a trust service puts its own P12 and
 * passphrase there instead.
 */
export async function loadOrCreateSigningKey(
  dir: string,
  organisation = 'Trenchward permits',
): Promise<SigningKey> {
  const p12Path = join(dir, P12_FILE)
  const passPath = join(dir, PASS_FILE)
  const certPath = join(dir, CERT_FILE)
  if (!existsSync(p12Path)) {
    await mkdir(dir, { recursive: true, mode: 0o700 })
    const keys = forge.pki.rsa.generateKeyPair({ bits: 2048, e: 0x10001 })
    const cert = forge.pki.createCertificate()
    cert.publicKey = keys.publicKey
    cert.serialNumber = '01' + randomBytes(8).toString('hex')
    cert.validity.notBefore = new Date()
    cert.validity.notAfter = new Date(Date.now() + 10 * 365.25 * 86_400_000)
    const attrs = [
      { name: 'commonName', value: `${organisation} signing key` },
      { name: 'organizationName', value: organisation },
    ]
    cert.setSubject(attrs)
    cert.setIssuer(attrs)
    cert.setExtensions([
      { name: 'basicConstraints', cA: false },
      { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
    ])
    cert.sign(keys.privateKey, forge.md.sha256.create())
    const passphrase = randomBytes(24).toString('base64url')
    const asn1 = forge.pkcs12.toPkcs12Asn1(keys.privateKey, [cert], passphrase, {
      algorithm: '3des',
    })
    const der = forge.asn1.toDer(asn1).getBytes()
    await writeFile(p12Path, Buffer.from(der, 'binary'), { mode: 0o600 })
    await writeFile(passPath, passphrase, { mode: 0o600 })
    await writeFile(certPath, forge.pki.certificateToPem(cert), { mode: 0o644 })
    await chmod(p12Path, 0o600)
  }
  const [p12, passphrase, certificatePem] = await Promise.all([
    readFile(p12Path),
    readFile(passPath, 'utf8'),
    readFile(certPath, 'utf8'),
  ])
  return {
    p12,
    passphrase: passphrase.trim(),
    certificatePem,
    certificateSha256: fingerprint(certificatePem),
  }
}
