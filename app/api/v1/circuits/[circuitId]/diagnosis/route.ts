import { db } from "@/db";
import { getCircuit, listReadings } from "@/db/queries/work";
import { ApiError } from "@/lib/api/errors";
import { workRoute } from "@/lib/api/work";
import { loadCircuit } from "@/lib/circuit";
import { diagnose } from "@/lib/diagnosis/report";

// GET /api/v1/circuits/:circuitId/diagnosis - every reading against the model, and where the readings put extra resistance
export const GET = workRoute({ resource: "circuit", need: "read" }, async ({ target }) => {
  const [circuit, readings] = await Promise.all([getCircuit(db, target.circuitId!), listReadings(db, target.circuitId!)]);
  if (!circuit) throw new ApiError(404, "not-found", "There is no such circuit.");
  const loaded = loadCircuit(circuit.document);
  if (!loaded.ok) throw new ApiError(409, "invalid-document", "The stored circuit no longer loads; open it in the workspace and save it again.");
  return Response.json({ circuit: { id: circuit.id, version: circuit.version }, ...diagnose(loaded.document, readings) });
});
