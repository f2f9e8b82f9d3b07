import { db } from "@/db";
import { getCircuit, listReadings } from "@/db/queries/work";
import { errorResponse } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { EXPORT_FORMAT } from "@/lib/validators/work";

// GET /api/v1/circuits/:circuitId/export - the document and its readings as one JSON file to download
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target }) => {
  const [circuit, readings] = await Promise.all([getCircuit(db, target.circuitId!), listReadings(db, target.circuitId!)]);
  if (!circuit) return errorResponse(404, "not-found", "There is no such circuit.");
  const file = {
    format: EXPORT_FORMAT,
    exportedAt: new Date().toISOString(),
    circuit: { name: circuit.name, version: circuit.version, document: circuit.document },
    readings: readings.map((r) => ({
      stateId: r.stateId,
      positive: r.positive,
      negative: r.negative,
      value: r.value,
      unit: r.unit,
      currentA: r.currentA,
      note: r.note,
      takenAt: r.takenAt.toISOString(),
      takenBy: r.takenByName,
    })),
  };
  const slug = circuit.name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "circuit";
  return new Response(JSON.stringify(file, null, 2), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${slug}-v${circuit.version}.ampwright.json"`,
      "cache-control": "private, no-store",
    },
  });
});
