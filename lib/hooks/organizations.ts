"use client";

import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/query/client";

export type MyOrganization = { organizationId: string; name: string; slug: string; kind: "shop" | "class"; role: string; roleLabel: string };

export const organizationKeys = { mine: ["organizations", "mine"] as const };

/** The signed-in user's shops and classes. */
export function useMyOrganizations(enabled: boolean) {
  return useQuery({
    queryKey: organizationKeys.mine,
    queryFn: () => apiFetch<{ organizations: MyOrganization[] }>("/api/v1/organizations").then((r) => r.organizations),
    enabled,
  });
}
