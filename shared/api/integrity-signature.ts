import { z } from 'zod';

/**
 * What the server signs when it stores a result. The signed bytes are
 * `SIGNED_STATEMENT_PREFIX + canonicalJson(statement)` in UTF-8 (see `signedStatementBytes`).
 */
export const signedStatementSchema = /* @__PURE__ */ z
  .object({
    runId: z.number().int(),
    fileSha256: z.string().meta({ description: 'SHA-256 of the archived log, hex.' }),
    fingerprint: z.string().meta({ description: "The result's fingerprint, hex." }),
    signedAt: z.string().meta({ description: 'When it was signed, ISO 8601 in UTC.' }),
  })
  .meta({ id: 'SignedStatement' });
export type SignedStatement = z.infer<typeof signedStatementSchema>;

/** A stored result's signature. */
export const resultSignatureSchema = /* @__PURE__ */ z
  .object({
    algorithm: z.literal('Ed25519'),
    keyId: z.string().meta({ description: 'Names the public key: the first 16 hex digits of the SHA-256 of its raw 32 bytes.' }),
    statement: signedStatementSchema,
    signature: z.string().meta({ description: 'The 64-byte Ed25519 signature, base64.' }),
  })
  .meta({ id: 'ResultSignatureDto' });
export type ResultSignatureDto = z.infer<typeof resultSignatureSchema>;

/** A public key the server signs (or signed) results with. */
export const signingKeySchema = /* @__PURE__ */ z
  .object({
    keyId: z.string(),
    algorithm: z.literal('Ed25519'),
    publicKeyPem: z.string().meta({ description: 'SubjectPublicKeyInfo, PEM: what `openssl pkey -pubin` reads.' }),
    createdAt: z.string(),
    retiredAt: z.string().nullable().meta({ description: 'Set once another key took over; results it signed still verify with it.' }),
  })
  .meta({ id: 'SigningKeyDto' });
export type SigningKeyDto = z.infer<typeof signingKeySchema>;
