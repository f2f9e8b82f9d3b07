import type { Metadata } from "next";
import { openApiDocument } from "@/lib/api/openapi";

export const metadata: Metadata = { title: "API reference" };

type JsonSchema = { type?: string | string[]; properties?: Record<string, JsonSchema>; required?: string[]; enum?: unknown[]; minimum?: number; maximum?: number; maxLength?: number; minLength?: number; default?: unknown; $ref?: string; anyOf?: JsonSchema[]; description?: string; nullable?: boolean };
type Operation = {
  summary: string;
  description: string;
  parameters?: { name: string; in: string; required: boolean; schema: JsonSchema }[];
  requestBody?: { content: { "application/json": { schema: JsonSchema } } };
  responses: Record<string, { description: string }>;
};

/** A schema's type in a few words: "number, 6 to 1000, default 12". */
function typeOf(s: JsonSchema): string {
  if (s.$ref) return s.$ref.split("/").pop() ?? "object";
  if (s.anyOf) return s.anyOf.map(typeOf).join(" or ");
  const parts = [s.enum ? s.enum.map((v) => JSON.stringify(v)).join(" | ") : Array.isArray(s.type) ? s.type.join(" or ") : (s.type ?? "any")];
  if (s.minimum !== undefined || s.maximum !== undefined) parts.push(`${s.minimum ?? "-"} to ${s.maximum ?? "-"}`);
  if (s.maxLength !== undefined) parts.push(`at most ${s.maxLength} characters`);
  if (s.nullable) parts.push("or null");
  if (s.default !== undefined) parts.push(`default ${JSON.stringify(s.default)}`);
  return parts.join(", ");
}

function Fields({ schema }: { schema: JsonSchema }) {
  const variants = schema.anyOf ?? [schema];
  return (
    <>
      {variants.map((v, i) => (
        <div key={i}>
          {variants.length > 1 ? <p className="mt-2 text-xs font-semibold uppercase text-graphite-500">{i === 0 ? "Either" : "or"}</p> : null}
          <table className="mt-1 w-full text-sm">
            <tbody className="divide-y divide-graphite-100">
              {Object.entries(v.properties ?? {}).map(([name, p]) => (
                <tr key={name}>
                  <td className="w-48 py-1 pr-3 align-top font-mono text-xs">
                    {name}
                    {v.required?.includes(name) ? <span className="text-over"> *</span> : null}
                  </td>
                  <td className="py-1 align-top text-graphite-700">{typeOf(p)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
    </>
  );
}

export default function Page() {
  const doc = openApiDocument();
  return (
    <div className="mx-auto max-w-5xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-semibold tracking-tight">API reference, version 1</h1>
      <p className="mt-2 text-graphite-700">
        {doc.info.description} Errors always come as <code className="font-mono text-sm">{'{ "error": { "code", "message", "issues" } }'}</code>. The same
        description as an OpenAPI 3.0 file:{" "}
        <a href="/api/v1/openapi.json" className="font-medium text-copper-700 underline">
          /api/v1/openapi.json
        </a>
        . Fields marked <span className="text-over">*</span> are required.
      </p>
      <div className="mt-8 space-y-6" data-testid="api-operations">
        {Object.entries(doc.paths).flatMap(([path, ops]) =>
          Object.entries(ops as Record<string, Operation>).map(([method, op]) => (
            <section key={`${method} ${path}`} className="rounded-lg border border-graphite-100 bg-paper-raised p-5" aria-label={`${method.toUpperCase()} ${path}`}>
              <h2 className="font-mono text-sm">
                <span className="mr-2 rounded bg-graphite-900 px-2 py-0.5 font-semibold text-white">{method.toUpperCase()}</span>
                {path}
              </h2>
              <p className="mt-2 font-medium">{op.summary}</p>
              <p className="text-sm text-graphite-700">{op.description}</p>
              {op.parameters?.length ? (
                <>
                  <h3 className="mt-3 text-xs font-semibold uppercase tracking-wider text-graphite-500">Parameters</h3>
                  <Fields schema={{ properties: Object.fromEntries(op.parameters.map((p) => [`${p.name} (${p.in})`, p.schema])), required: op.parameters.filter((p) => p.required).map((p) => `${p.name} (${p.in})`) }} />
                </>
              ) : null}
              {op.requestBody ? (
                <>
                  <h3 className="mt-3 text-xs font-semibold uppercase tracking-wider text-graphite-500">JSON body</h3>
                  <Fields schema={op.requestBody.content["application/json"].schema} />
                </>
              ) : null}
              <h3 className="mt-3 text-xs font-semibold uppercase tracking-wider text-graphite-500">Answers</h3>
              <ul className="mt-1 text-sm">
                {Object.entries(op.responses).map(([code, r]) => (
                  <li key={code}>
                    <span className="font-mono">{code}</span> {r.description}
                  </li>
                ))}
              </ul>
            </section>
          )),
        )}
      </div>
    </div>
  );
}
