import { S3Client } from "@aws-sdk/client-s3";
import sharp from "sharp";
import { env } from "@/lib/env";

/**
 * An S3 client for the configured store: any S3-compatible service, addressed path-style, with checksums only where
 * the service asks for them, so presigned uploads behave the same on the local stand-in (s3rver) and on a real
 * store. Free of "server-only" so the demo seed (a plain script) builds its client the same way as the server.
 */
export function makeS3Client(opts: { maxAttempts?: number } = {}): S3Client {
  const e = env();
  return new S3Client({
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    forcePathStyle: true,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    ...(opts.maxAttempts ? { maxAttempts: opts.maxAttempts } : {}),
  });
}

/** Thumbnails: at most 320 px on the long side, WebP, turned upright by the photo's own orientation. */
export const THUMB_PX = 320;
export function thumbnailOf(photo: Buffer): Promise<Buffer> {
  return sharp(photo).rotate().resize(THUMB_PX, THUMB_PX, { fit: "inside", withoutEnlargement: true }).webp({ quality: 72 }).toBuffer();
}

/** Where a photo's thumbnail is kept, beside the photo. */
export const thumbnailKeyOf = (objectKey: string) => `${objectKey}.thumb.webp`;
