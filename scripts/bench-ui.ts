/**
 * The browser half of `npm run bench:ui` (scripts/bench-api.sh starts the production server): in headless
 * Chromium, (1) the sizing page's time from a keystroke to the next frame that shows the new answer, for the AWG
 * and the metric series; (2) the workspace on a 300-component circuit: time from an edit (Enter in the properties
 * panel) to the next frame showing the re-solved overlay, once with the whole drawing fitted (zoomed out so far that
 * the parts' figures are left out of the layout; the edit is watched on the farthest load's figures, which still
 * change in the page) and once at a working zoom around the edited joint (its figures drawn and watched), and the
 * frame rate while panning. Prints figures; it is not a test.
 */
import { writeFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { launchBrowser } from "../tests/support/chromium";
import { harnessCircuit } from "../tests/support/harness";

const base = process.env.APP_URL ?? "http://127.0.0.1:3200";
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 30);

const stats = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const at = (p: number) => s[Math.min(s.length - 1, Math.floor(p * s.length))];
  return `median ${at(0.5).toFixed(1)} ms, p95 ${at(0.95).toFixed(1)} ms, max ${s[s.length - 1].toFixed(1)} ms (${s.length} samples)`;
};

/**
 * Arms a timer in the page: from the next keydown of `key` to the first animation frame after `watched` changes.
 * Resolves in the page with the milliseconds.
 */
async function armKeyToFrame(page: Page, key: string, watchedSelector: string) {
  // A script string, not a function: the bundler's helpers for function names do not exist in the page.
  await page.evaluate(`
    window.__lap = new Promise((resolve) => {
      let t0 = 0;
      const target = document.querySelector(${JSON.stringify(watchedSelector)});
      const before = target.textContent;
      const onKey = (e) => { if (e.key === ${JSON.stringify(key)} && !t0) t0 = performance.now(); };
      document.addEventListener("keydown", onKey, true);
      const obs = new MutationObserver(() => {
        if (!t0 || target.textContent === before) return;
        obs.disconnect();
        document.removeEventListener("keydown", onKey, true);
        requestAnimationFrame(() => resolve(performance.now() - t0));
      });
      obs.observe(target, { subtree: true, childList: true, characterData: true });
    });
    undefined; // the promise is collected later by lap(), not awaited here
  `);
}
const lap = (page: Page) => page.evaluate("window.__lap") as Promise<number>;

async function sizingPage(page: Page) {
  for (const family of ["awg", "metric"] as const) {
    await page.goto(`${base}/size?family=${family}&current=40%20A&length=3%20m`, { waitUntil: "networkidle" });
    await page.getByTestId("size-recommended").waitFor();
    const laps: number[] = [];
    const field = page.getByTestId("size-length");
    for (let i = 0; i < ROUNDS; i++) {
      // Alternate 3 m and 30 m by typing or deleting one "0": each keystroke changes the answer's figures.
      await field.focus();
      await page.keyboard.press("End");
      await page.keyboard.press("ArrowLeft");
      await page.keyboard.press("ArrowLeft");
      const grow = i % 2 === 0;
      await armKeyToFrame(page, grow ? "0" : "Backspace", '[data-testid="size-result"] table');
      await page.keyboard.press(grow ? "0" : "Backspace");
      laps.push(await lap(page));
    }
    const rows = await page.locator('[data-testid="size-result"] tbody tr').count();
    console.log(`Sizing page, ${family.toUpperCase()} series (${rows} sizes): keystroke to the frame with the new answer: ${stats(laps)}`);
  }
}

async function signIn(page: Page) {
  await page.goto(`${base}/sign-in?next=/account`, { waitUntil: "networkidle" });
  await page.getByTestId("sign-in-email").fill("tobias@larkspur.example");
  await page.getByTestId("sign-in-password").fill("larkspur-demo-2026");
  await page.getByTestId("sign-in-submit").click();
  await page.waitForURL((u) => u.pathname === "/account");
}

async function workspace(page: Page) {
  const doc = { ...harnessCircuit(300), name: "UI bench harness" };
  const api = async (path: string, body: unknown) => {
    const res = await page.request.post(`${base}${path}`, { data: body, headers: { origin: base } });
    if (!res.ok()) throw new Error(`${path} answered ${res.status()}: ${await res.text()}`);
    return res.json();
  };
  const job = await api("/api/v1/jobs", { organizationId: "org_demo_shop", title: "UI bench" });
  const circuit = await api(`/api/v1/jobs/${job.job.id}/circuits`, { document: doc });
  await page.goto(`${base}/circuits/${circuit.circuit.id}/workspace`, { waitUntil: "networkidle" });
  const loads = doc.components.filter((c) => c.kind === "load");
  const far = loads[loads.length - 1].id;
  await page.getByTestId(`part-${far}`).waitFor();
  await page.waitForFunction((id) => /V/.test(document.querySelector(`[data-testid="part-${id}"]`)?.textContent ?? ""), far);
  await page.getByTestId("ws-results").waitFor();
  // Pick the first joint of the ladder from the results table (a row click selects it on the canvas), then show
  // the table as it first appears again.
  await page.getByTestId("ws-results-all").click();
  await page.locator('[data-row-id="J1"]').click();
  await page.getByTestId("ws-results-all").click();
  const field = page.getByTestId("prop-resistance");
  await field.waitFor();
  const laps: number[] = [];
  // BENCH_PROFILE=file.cpuprofile records the page's JavaScript during the edits (open it in Chromium's DevTools).
  const profile = process.env.BENCH_PROFILE ? await page.context().newCDPSession(page) : undefined;
  if (profile) {
    await profile.send("Profiler.enable");
    await profile.send("Profiler.start");
  }
  // BENCH_TRACE=file.json records a Chromium performance trace of the edits (style, layout, paint and script).
  if (process.env.BENCH_TRACE) await page.context().browser()!.startTracing(page, { path: process.env.BENCH_TRACE, categories: ["devtools.timeline", "disabled-by-default-devtools.timeline"] });
  for (let i = 0; i < ROUNDS; i++) {
    await field.fill(i % 2 === 0 ? "60 mOhm" : "0.5 mOhm");
    await armKeyToFrame(page, "Enter", `[data-testid="part-${far}"]`);
    await field.press("Enter");
    laps.push(await lap(page));
  }
  if (process.env.BENCH_TRACE) await page.context().browser()!.stopTracing();
  if (profile) {
    const { profile: data } = await profile.send("Profiler.stop");
    writeFileSync(process.env.BENCH_PROFILE!, JSON.stringify(data));
  }
  const zoomOf = () => page.evaluate("Number(/scale\\(([\\d.]+)\\)/.exec(document.querySelector('.react-flow__viewport').style.transform)[1])") as Promise<number>;
  console.log(`Workspace, ${doc.components.length} components and ${doc.wires.length} cables, whole drawing fitted (zoom ${(await zoomOf()).toFixed(2)}): edit to the frame with the new overlay: ${stats(laps)}`);

  await pan(page, "whole drawing fitted");

  // At a working zoom: the workspace opened on the joint (as a test plan's link opens it), its figures readable.
  await page.goto(`${base}/circuits/${circuit.circuit.id}/workspace?focus=J1`, { waitUntil: "networkidle" });
  await page.getByTestId("part-J1").waitFor();
  await page.waitForFunction(() => document.querySelector('[data-testid="ws-canvas"]')?.getAttribute("data-far") === "false");
  await page.waitForTimeout(600); // the focus animation
  const near: number[] = [];
  for (let i = 0; i < ROUNDS; i++) {
    await field.fill(i % 2 === 0 ? "60 mOhm" : "0.5 mOhm");
    await armKeyToFrame(page, "Enter", '[data-testid="part-J1"]');
    await field.press("Enter");
    near.push(await lap(page));
  }
  console.log(`Workspace, same circuit at a working zoom (${(await zoomOf()).toFixed(2)}) around J1, its figures drawn: edit to the frame with the new overlay: ${stats(near)}`);

  await pan(page, "working zoom, figures drawn");
}

/** Panning: drag an empty spot of the canvas for two seconds and count the frames drawn meanwhile. */
async function pan(page: Page, what: string) {
  const box = (await page.getByTestId("ws-canvas").boundingBox())!;
  // An empty spot (the pane itself, not a part or a cable) nearest the canvas's middle, so the drag pans instead of
  // moving a part and the pointer stays over the canvas while it swings.
  const spot = (await page.evaluate(`(() => {
    const cx = ${Math.round(box.x + box.width / 2)}, cy = ${Math.round(box.y + box.height / 2)};
    for (let r = 0; r < ${Math.round(box.height / 2 - 50)}; r += 10)
      for (let a = 0; a < 360; a += 15) {
        const x = Math.round(cx + r * Math.cos(a * Math.PI / 180)), y = Math.round(cy + r * Math.sin(a * Math.PI / 180));
        if (document.elementFromPoint(x, y)?.classList.contains("react-flow__pane")) return [x, y];
      }
    return null;
  })()`)) as [number, number] | null;
  if (!spot) throw new Error("no empty spot on the canvas to pan from");
  await page.evaluate(`
    window.__frames = 0;
    window.__counting = true;
    const tick = () => { if (!window.__counting) return; window.__frames++; requestAnimationFrame(tick); };
    requestAnimationFrame(tick);
  `);
  const start = Date.now();
  const [cx, cy] = spot;
  await page.mouse.move(cx, cy);
  await page.mouse.down();
  let step = 0;
  while (Date.now() - start < 2000) {
    step++;
    await page.mouse.move(cx + 200 * Math.sin(step / 10), cy + 40 * Math.cos(step / 10));
  }
  await page.mouse.up();
  const seconds = (Date.now() - start) / 1000;
  const frames = (await page.evaluate("window.__counting = false, window.__frames")) as number;
  console.log(`Workspace panning, ${what}: ${(frames / seconds).toFixed(1)} frames per second over ${seconds.toFixed(1)} s (${step} pointer moves)`);
}

async function main() {
  const browser = await launchBrowser();
  try {
    const context = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
    const page = await context.newPage();
    console.log(`Browser figures on ${base}, headless Chromium ${browser.version()}, ${ROUNDS} rounds each; one frame is 16.7 ms at 60 Hz`);
    await sizingPage(page);
    await signIn(page);
    await workspace(page);
  } finally {
    await browser.close();
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
