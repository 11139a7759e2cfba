import { constants, createPrivateKey, privateEncrypt } from 'node:crypto'
import type { KeyObject } from 'node:crypto'
import { Signer } from '@signpdf/signpdf'
import forge from 'node-forge'
import type { SigningKey } from './signing-key.ts'

/** DER prefix of a SHA-256 DigestInfo (RFC 8017, section 9.2, note 1). */
const SHA256_DIGEST_INFO = Buffer.from('3031300d060960864801650304020105000420', 'hex')

interface Unpacked {
  certificates: forge.pki.Certificate[]
  certificate: forge.pki.Certificate
  key: KeyObject
}

/**
 * The same detached PKCS#7 signature as @signpdf's P12Signer (SHA-256, the same signed
 * attributes in the same order, every certificate of the bundle), with two differences: the
 * PKCS#12 bundle is unpacked once per key instead of on every signature, and the RSA operation
 * runs in Node's native crypto instead of JavaScript big-number code. Both took most of the
 * time of issuing a permit.
 */
export class NativeKeySigner extends Signer {
  private static unpacked = new WeakMap<SigningKey, Unpacked>()
  constructor(private readonly signingKey: SigningKey) {
    super()
  }

  private unpack(): Unpacked {
    const hit = NativeKeySigner.unpacked.get(this.signingKey)
    if (hit) return hit
    const p12 = forge.pkcs12.pkcs12FromAsn1(
      forge.asn1.fromDer(forge.util.createBuffer(this.signingKey.p12.toString('binary'))),
      false,
      this.signingKey.passphrase,
    )
    const CERT_BAG = forge.pki.oids.certBag!
    const KEY_BAG = forge.pki.oids.pkcs8ShroudedKeyBag!
    const certificates = (p12.getBags({ bagType: CERT_BAG })[CERT_BAG] ?? [])
      .map((b: forge.pkcs12.Bag) => b.cert)
      .filter((c): c is forge.pki.Certificate => c !== undefined)
    const privateKey = p12.getBags({ bagType: KEY_BAG })[KEY_BAG]?.[0]?.key as
      forge.pki.rsa.PrivateKey | undefined
    if (!privateKey) throw new Error('The signing bundle holds no private key')
    const certificate = certificates.find((c: forge.pki.Certificate) => {
      const pub = c.publicKey as forge.pki.rsa.PublicKey
      return privateKey.n.compareTo(pub.n) === 0 && privateKey.e.compareTo(pub.e) === 0
    })
    if (!certificate) throw new Error('No certificate in the signing bundle matches its key')
    const key = createPrivateKey(forge.pki.privateKeyToPem(privateKey))
    const out = { certificates, certificate, key }
    NativeKeySigner.unpacked.set(this.signingKey, out)
    return out
  }

  override async sign(pdfBuffer: Buffer, signingTime?: Date): Promise<Buffer> {
    const { certificates, certificate, key } = this.unpack()
    const p7 = forge.pkcs7.createSignedData()
    p7.content = forge.util.createBuffer(pdfBuffer.toString('binary'))
    for (const c of certificates) p7.addCertificate(c)
    // forge builds the signed attributes and hashes them; only the RSA step is ours.
    const rsa = {
      sign(md: forge.md.MessageDigest): string {
        if (md.algorithm !== 'sha256') throw new Error(`unexpected digest ${md.algorithm}`)
        const digest = Buffer.from(md.digest().getBytes(), 'binary')
        const encoded = Buffer.concat([SHA256_DIGEST_INFO, digest])
        return privateEncrypt({ key, padding: constants.RSA_PKCS1_PADDING }, encoded).toString(
          'binary',
        )
      },
    }
    p7.addSigner({
      key: rsa as unknown as forge.pki.rsa.PrivateKey,
      certificate,
      digestAlgorithm: forge.pki.oids.sha256!,
      authenticatedAttributes: [
        { type: forge.pki.oids.contentType!, value: forge.pki.oids.data },
        {
          type: forge.pki.oids.signingTime!,
          value: (signingTime ?? new Date()) as unknown as string,
        },
        { type: forge.pki.oids.messageDigest! },
      ],
    })
    p7.sign({ detached: true })
    return Buffer.from(forge.asn1.toDer(p7.toAsn1()).getBytes(), 'binary')
  }
}
