import { z } from "zod";
import { PG_INT_MAX, plainText } from "./text";

const text = plainText;

/** Publishing a circuit to a class as a lesson, or republishing it as a new snapshot. */
export const publishLessonInput = z.strictObject({
  title: text("title", 200).min(2, 'give the lesson a title of at least 2 characters (e.g. "Finding a ground-side drop")'),
  brief: text("brief", 4000).default(""),
  questions: z
    .array(z.strictObject({ prompt: text("prompt", 500).min(3, "a question needs at least 3 characters, or remove it") }), { error: "questions must be a list" })
    .max(20, "a lesson has at most 20 questions")
    .default([]),
});
export type PublishLessonInput = z.input<typeof publishLessonInput>;

/** Which snapshot of a lesson to open; the latest when not given. */
export const lessonVersionQuery = z.strictObject({
  version: z.coerce.number({ error: "version must be a whole number" }).int("version must be a whole number").min(1, "versions start at 1").max(PG_INT_MAX, "no lesson has that many versions").optional(),
});
