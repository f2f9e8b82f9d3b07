import { db } from "@/db";
import { getCircuit } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { loadCircuit } from "@/lib/circuit";
import { resultsCsv } from "@/lib/report/csv";
import { downloadHeaders, slugOf } from "@/lib/report/files";

// GET /api/v1/circuits/:circuitId/results.csv - every part and cable solved in every operating state, as CSV
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target }) => {
  const circuit = await getCircuit(db, target.circuitId!);
  if (!circuit) throw new ApiError(404, "not-found", "There is no such circuit.");
  const loaded = loadCircuit(circuit.document);
  if (!loaded.ok) throw new ApiError(409, "invalid-document", "The stored circuit no longer loads; open it in the workspace and save it again.");
  return new Response(resultsCsv(loaded.document), { headers: downloadHeaders("text/csv; charset=utf-8", `${slugOf(circuit.name, "circuit")}-v${circuit.version}-results.csv`) });
});
