import { describe, expect, it } from "vitest";
import { ViewStore } from "@/components/workspace/canvas-view";

/** A store of strings compared by their first letter, with a log of which ids were told. */
function logged() {
  const store = new ViewStore<string>((a, b) => a[0] === b[0]);
  const told: string[] = [];
  for (const id of ["A", "B", "C"]) store.subscribe(id, () => told.push(id));
  return { store, told };
}

describe("canvas view store", () => {
  it("tells only the ids whose value draws differently, appeared or went", () => {
    const { store, told } = logged();
    store.replace(new Map([["A", "apple"], ["B", "bean"]]));
    expect(told.sort()).toEqual(["A", "B"]);
    told.length = 0;
    // A draws the same (same first letter), B changes, C appears.
    store.replace(new Map([["A", "apricot"], ["B", "carrot"], ["C", "date"]]));
    expect(told.sort()).toEqual(["B", "C"]);
    expect(store.get("A")).toBe("apple"); // a value that draws the same is not swapped in
    expect(store.get("B")).toBe("carrot");
    told.length = 0;
    store.replace(new Map([["A", "apricot"]]));
    expect(told.sort()).toEqual(["B", "C"]);
    expect(store.get("B")).toBeUndefined();
  });

  it("stops telling a listener once it unsubscribes", () => {
    const store = new ViewStore<number>((a, b) => a === b);
    let calls = 0;
    const stop = store.subscribe("X", () => calls++);
    store.replace(new Map([["X", 1]]));
    stop();
    store.replace(new Map([["X", 2]]));
    expect(calls).toBe(1);
  });
});
