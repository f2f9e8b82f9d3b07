import "server-only";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, type S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";
import { makeS3Client } from "./client";

let client: S3Client | undefined;

/** The object store's client, made once (see makeS3Client). */
export function s3(): S3Client {
  client ??= makeS3Client();
  return client;
}

const bucket = () => env().S3_BUCKET;

/** How long a presigned upload or download URL works. */
export const UPLOAD_URL_SECONDS = 15 * 60;
export const DOWNLOAD_URL_SECONDS = 5 * 60;

/** A URL the browser PUTs the file to, signed for this key and content type. */
export function presignUpload(key: string, contentType: string): Promise<string> {
  return getSignedUrl(s3(), new PutObjectCommand({ Bucket: bucket(), Key: key, ContentType: contentType }), { expiresIn: UPLOAD_URL_SECONDS });
}

/** A short-lived URL to read an object, with the name and type the browser should give it. */
export function presignDownload(key: string, p: { fileName: string; contentType: string; inline: boolean }): Promise<string> {
  const safe = p.fileName.replace(/["\\\r\n]/g, "_");
  return getSignedUrl(
    s3(),
    new GetObjectCommand({
      Bucket: bucket(),
      Key: key,
      ResponseContentType: p.contentType,
      ResponseContentDisposition: `${p.inline ? "inline" : "attachment"}; filename="${safe}"`,
    }),
    { expiresIn: DOWNLOAD_URL_SECONDS },
  );
}

/** The stored size of an object, or undefined when there is none. */
export async function objectSize(key: string): Promise<number | undefined> {
  try {
    const head = await s3().send(new HeadObjectCommand({ Bucket: bucket(), Key: key }));
    return head.ContentLength ?? 0;
  } catch (err) {
    const status = (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status === 404 || (err as { name?: string }).name === "NotFound" || (err as { name?: string }).name === "NoSuchKey") return undefined;
    throw err;
  }
}

/** An object's bytes (call objectSize first: this reads the whole object into memory). */
export async function readObject(key: string): Promise<Buffer> {
  const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return Buffer.from(await res.Body!.transformToByteArray());
}

export async function writeObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}
