import { sizeCable, type DevicePreference, type MaterialId } from "@/lib/conductors";
import { route } from "@/lib/api/route";
import { cableSizeRequest } from "@/lib/validators/cable-size";

// POST /api/v1/cable-size - the smallest cable and its fuse for a load (no sign-in)
export const POST = route({ body: cableSizeRequest, maxBytes: 64_000, crossSite: "compute" }, ({ body }) => {
  const answer = sizeCable({ ...body, material: body.material as MaterialId, minSize: body.minSize, device: body.device as DevicePreference });
  return Response.json(answer);
});
