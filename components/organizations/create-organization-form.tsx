"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormError } from "@/components/ui/field";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import { createOrganizationInput, type CreateOrganizationInput } from "@/lib/validators/organizations";

export function CreateOrganizationForm() {
  const router = useRouter();
  const form = useForm<CreateOrganizationInput>({ resolver: zodResolver(createOrganizationInput), defaultValues: { kind: "shop", name: "" } });
  const create = useMutation<{ organization: { id: string } }, ApiClientError, CreateOrganizationInput>({
    mutationFn: (json) => apiFetch("/api/v1/organizations", { method: "POST", json }),
    onSuccess: (res) => router.push(`/organizations/${res.organization.id}`),
  });
  return (
    <form onSubmit={form.handleSubmit((v) => create.mutate(v))} className="grid gap-4 sm:grid-cols-[1fr_auto_auto] sm:items-end" noValidate>
      <Field label="Name" registration={form.register("name")} error={form.formState.errors.name?.message} testId="org-name" />
      <fieldset className="text-sm">
        <legend className="font-medium text-graphite-800">It is a</legend>
        <div className="mt-1 flex gap-3">
          <label className="flex items-center gap-1.5">
            <input type="radio" value="shop" {...form.register("kind")} data-testid="org-kind-shop" /> shop
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="class" {...form.register("kind")} data-testid="org-kind-class" /> class
          </label>
        </div>
      </fieldset>
      <button type="submit" className="rounded-md bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700" disabled={create.isPending} data-testid="org-create">
        Create
      </button>
      <div className="sm:col-span-3">
        <FormError message={create.error?.message} />
      </div>
    </form>
  );
}
