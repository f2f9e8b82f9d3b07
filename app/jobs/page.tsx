import type { Metadata } from "next";
import { AreaPreview } from "@/components/shell/area-preview";
import { areaByHref } from "@/lib/areas";

const area = areaByHref("/jobs");

export const metadata: Metadata = { title: area.label };

export default function Page() {
  return <AreaPreview area={area} />;
}
