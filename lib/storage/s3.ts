import "server-only";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, type S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";
import { contentDisposition } from "@/lib/report/files";
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
  return getSignedUrl(
    s3(),
    new GetObjectCommand({
      Bucket: bucket(),
      Key: key,
      ResponseContentType: p.contentType,
      ResponseContentDisposition: contentDisposition(p.fileName, p.inline),
    }),
    { expiresIn: DOWNLOAD_URL_SECONDS },
  );
}

/**
 * An object's bytes, read until `maxBytes`: past that it stops reading and answers "too-large" with what it saw,
 * so a file swapped for a larger one between a size check and the read cannot fill the server's memory.
 */
export async function readObjectLimited(key: string, maxBytes: number): Promise<{ bytes: Buffer } | { tooLarge: number } | { missing: true }> {
  let res;
  try {
    res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  } catch (err) {
    if (notFound(err)) return { missing: true };
    throw err;
  }
  const declared = res.ContentLength ?? 0;
  const body = res.Body as unknown as AsyncIterable<Uint8Array> & { destroy?: () => void };
  if (declared > maxBytes) {
    body.destroy?.();
    return { tooLarge: declared };
  }
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of body) {
    size += chunk.byteLength;
    if (size > maxBytes) {
      body.destroy?.();
      return { tooLarge: size };
    }
    chunks.push(Buffer.from(chunk));
  }
  return { bytes: Buffer.concat(chunks) };
}

/** An object as a stream for a response body, with its length. */
export async function streamObject(key: string): Promise<{ body: ReadableStream; length?: number } | undefined> {
  try {
    const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return { body: res.Body!.transformToWebStream(), length: res.ContentLength };
  } catch (err) {
    if (notFound(err)) return undefined;
    throw err;
  }
}

function notFound(err: unknown): boolean {
  const status = (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
  const name = (err as { name?: string }).name;
  return status === 404 || name === "NotFound" || name === "NoSuchKey";
}

export async function writeObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}
