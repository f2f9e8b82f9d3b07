import { z } from "zod";
import { idText, plainText } from "./text";

export const SHARE_MAX_DAYS = 365;

const days = z
  .number({ error: "expiresInDays must be a whole number of days" })
  .int("expiresInDays must be a whole number of days")
  .min(1, "a link lasts at least 1 day")
  .max(SHARE_MAX_DAYS, `a link lasts at most ${SHARE_MAX_DAYS} days`);

export const createShareLinkInput = z.strictObject({
  /** Share one circuit of the job instead of the whole job. */
  circuitId: idText("circuitId").optional(),
  label: plainText("label", 200).default(""),
  /** Days until the link stops working; null or left out for a link that lasts until revoked. */
  expiresInDays: days.nullable().default(null),
});
export type CreateShareLinkInput = z.input<typeof createShareLinkInput>;

export const emailReportInput = z.strictObject({
  to: z.string({ error: "to must be an e-mail address" }).trim().toLowerCase().email("enter an e-mail address such as name@shop.example"),
  message: plainText("message", 2000).default(""),
  /** Also make a read-only link to the report that lasts this many days (none when left out). */
  linkDays: days.nullable().default(null),
});
export type EmailReportInput = z.input<typeof emailReportInput>;
