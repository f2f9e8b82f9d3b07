"use client";

import { getNodesBounds, getViewportForBounds, type Node } from "@xyflow/react";
import { toPng, toSvg } from "html-to-image";

/** Downloads the whole drawing (not just what is on screen) as SVG or PNG, fitted to a fixed frame. */
export async function exportCanvas(wrapper: HTMLElement | null, nodes: Node[], name: string, format: "svg" | "png") {
  const viewport = wrapper?.querySelector<HTMLElement>(".react-flow__viewport");
  if (!viewport || !nodes.length) return;
  const width = 1600;
  const height = 1000;
  const bounds = getNodesBounds(nodes);
  const vp = getViewportForBounds(bounds, width, height, 0.2, 2, 0.08);
  const options = {
    backgroundColor: "#ffffff",
    width,
    height,
    style: { width: `${width}px`, height: `${height}px`, transform: `translate(${vp.x}px, ${vp.y}px) scale(${vp.zoom})` },
  };
  const url = format === "svg" ? await toSvg(viewport, options) : await toPng(viewport, options);
  const a = document.createElement("a");
  a.href = url;
  a.download = `${name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "circuit"}.${format}`;
  a.click();
}
