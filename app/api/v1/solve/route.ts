import { loadCircuit } from "@/lib/circuit";
import { ApiError } from "@/lib/api/errors";
import { route } from "@/lib/api/route";
import { solveCircuit } from "@/lib/solver";
import { MAX_SOLVE_BYTES, MAX_SOLVE_COMPONENTS, solveRequest } from "@/lib/validators/solve";

// POST /api/v1/solve - voltages, currents and drops of one operating state of a circuit (no sign-in)
export const POST = route({ body: solveRequest, maxBytes: MAX_SOLVE_BYTES, crossSite: "compute" }, ({ body }) => {
  const components = body.circuit.components;
  if (Array.isArray(components) && components.length > MAX_SOLVE_COMPONENTS) {
    throw new ApiError(422, "too-many-components", `This circuit has ${components.length} components; the solver takes at most ${MAX_SOLVE_COMPONENTS} per request.`, [
      { path: "circuit.components", message: `at most ${MAX_SOLVE_COMPONENTS} components` },
    ]);
  }
  const loaded = loadCircuit(body.circuit);
  if (!loaded.ok) {
    throw new ApiError(422, "invalid-circuit", "The circuit document is not valid; see issues.", loaded.issues.map((i) => ({ ...i, path: `circuit.${i.path}` })));
  }
  return Response.json(solveCircuit(loaded.document, { state: body.state }));
});
