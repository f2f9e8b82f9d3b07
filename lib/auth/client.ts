"use client";

import { organizationClient } from "better-auth/client/plugins";
import { createAuthClient } from "better-auth/react";

/** better-auth in the browser: same origin as the page, so no base URL is needed. */
export const authClient = createAuthClient({ plugins: [organizationClient()] });
