import { z } from "zod";
import { plainText } from "./text";
import { ROLES } from "@/lib/auth/permissions";

export const createOrganizationInput = z.strictObject({
  name: plainText("name", 100).min(2, "give it a name of at least 2 characters"),
  kind: z.enum(["shop", "class"], { error: 'kind is "shop" or "class"' }),
});
export const renameOrganizationInput = createOrganizationInput.pick({ name: true });
export const inviteInput = z.strictObject({
  email: z.string().trim().toLowerCase().email("enter an e-mail address such as name@shop.example"),
  role: z.enum(ROLES, { error: `role is one of ${ROLES.join(", ")}` }),
});
export const changeRoleInput = inviteInput.pick({ role: true });
export type CreateOrganizationInput = z.infer<typeof createOrganizationInput>;
export type InviteInput = z.infer<typeof inviteInput>;
