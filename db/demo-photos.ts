import { createHash } from "node:crypto";
import { HeadBucketCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import sharp from "sharp";
import { env } from "@/lib/env";
import { makeS3Client, thumbnailKeyOf, thumbnailOf } from "@/lib/storage/client";

/**
 * The demo's photos: a picture of a meter showing a reading, drawn here (shapes only, so no font is needed) and put
 * in the object store the way an upload lands. Invented images for the invented story.
 */

// Seven-segment digits: which of the segments a to g are lit.
const SEGMENTS: Record<string, string> = { "0": "abcdef", "1": "bc", "2": "abdeg", "3": "abcdg", "4": "bcfg", "5": "acdfg", "6": "acdefg", "7": "abc", "8": "abcdefg", "9": "abcdfg" };

function digitRects(ch: string, x: number, y: number, w: number, h: number): string {
  const t = w * 0.18;
  const half = h / 2;
  const seg: Record<string, [number, number, number, number]> = {
    a: [x + t, y, w - 2 * t, t],
    b: [x + w - t, y + t, t, half - t * 1.5],
    c: [x + w - t, y + half + t / 2, t, half - t * 1.5],
    d: [x + t, y + h - t, w - 2 * t, t],
    e: [x, y + half + t / 2, t, half - t * 1.5],
    f: [x, y + t, t, half - t * 1.5],
    g: [x + t, y + half - t / 2, w - 2 * t, t],
  };
  return [...(SEGMENTS[ch] ?? "")].map((s) => `<rect x="${seg[s]![0]}" y="${seg[s]![1]}" width="${seg[s]![2]}" height="${seg[s]![3]}" rx="4" fill="#1d2125"/>`).join("");
}

/** A 1200 x 900 JPEG of a handheld meter whose screen shows `reading` (digits and one decimal point). */
export async function meterPhoto(reading: string): Promise<Buffer> {
  let x = 360;
  const parts: string[] = [];
  for (const ch of reading) {
    if (ch === ".") {
      parts.push(`<rect x="${x - 14}" y="392" width="22" height="22" fill="#1d2125"/>`);
      x += 24;
    } else {
      parts.push(digitRects(ch, x, 250, 110, 164));
      x += 150;
    }
  }
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="900">
    <defs><linearGradient id="bench" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#6b5b4a"/><stop offset="1" stop-color="#3f352b"/></linearGradient></defs>
    <rect width="1200" height="900" fill="url(#bench)"/>
    <rect x="250" y="80" width="700" height="760" rx="60" fill="#c26f33"/>
    <rect x="290" y="120" width="620" height="680" rx="40" fill="#2a3036"/>
    <rect x="330" y="200" width="540" height="260" rx="16" fill="#b9c9a4"/>
    ${parts.join("")}
    <circle cx="600" cy="620" r="110" fill="#14171a"/><rect x="590" y="520" width="20" height="70" rx="8" fill="#e4e7ea"/>
    <circle cx="420" cy="760" r="26" fill="#b0301f"/><circle cx="780" cy="760" r="26" fill="#14171a"/>
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 82 }).toBuffer();
}

/** Puts a photo and its thumbnail in the object store; undefined when the store cannot be reached (then try later). */
export async function storeDemoPhoto(key: string, photo: Buffer): Promise<{ sizeBytes: number; sha256: string; thumbnailKey: string } | undefined> {
  const e = env();
  const s3 = makeS3Client({ maxAttempts: 1 });
  try {
    await s3.send(new HeadBucketCommand({ Bucket: e.S3_BUCKET }));
  } catch {
    return undefined;
  }
  const thumbnailKey = thumbnailKeyOf(key);
  const thumb = await thumbnailOf(photo);
  await s3.send(new PutObjectCommand({ Bucket: e.S3_BUCKET, Key: key, Body: photo, ContentType: "image/jpeg" }));
  await s3.send(new PutObjectCommand({ Bucket: e.S3_BUCKET, Key: thumbnailKey, Body: thumb, ContentType: "image/webp" }));
  s3.destroy();
  return { sizeBytes: photo.length, sha256: createHash("sha256").update(photo).digest("hex"), thumbnailKey };
}
