import type { CircuitDocument, Component, Wire } from "@/lib/circuit";

/**
 * Starting points for a new circuit, drawn on invented vehicles. Values are typical starting figures to be replaced
 * by the vehicle's own (service information, the battery's label, measured lengths); they are not reference data.
 */
export type Template = { id: string; name: string; summary: string; build: (systemVoltage: number) => CircuitDocument };

const at = (x: number, y: number) => ({ position: { x, y } });
const joint = (id: string, label: string, x: number, y: number, resistance = 0.0003): Component => ({ id, kind: "joint", label, resistance, ...at(x, y) });
const link = (id: string, from: string, to: string): Wire => ({ id, from, to, resistanceOhm: 0 });
const cable = (id: string, label: string, from: string, to: string, size: string, lengthM: number, zone: Wire["zone"]): Wire => ({ id, label, from, to, size, lengthM, material: "copper", zone });
const scale = (v: number, systemVoltage: number) => +((v * systemVoltage) / 12).toFixed(2);

function empty(name: string, systemVoltage: number): CircuitDocument {
  return { schema: "ampwright.circuit/1", name, systemVoltage, components: [], wires: [] };
}

function charging(systemVoltage: number, batteries: 1 | 2): CircuitDocument {
  const components: Component[] = [
    { id: "B1", kind: "battery", label: "Battery 1", openCircuitVoltage: scale(12.6, systemVoltage), internalResistance: 0.006, ...at(40, 240) },
    joint("JBP", "Battery + post to clamp", 40, 60),
    joint("JBN", "Battery - post to clamp", 40, 420),
    { id: "F1", kind: "fuse", label: "B+ fuse", rating: 200, resistance: 0.0003, ...at(260, 60) },
    joint("JAB", "Alternator B+ stud", 480, 60),
    { id: "A1", kind: "alternator", label: "Alternator", regulatedVoltage: scale(14.2, systemVoltage), ratedCurrent: 150, enabled: false, ...at(720, 160) },
    joint("JAC", "Alternator mounting (case to block)", 720, 340),
    { id: "GE", kind: "ground", label: "Engine block", ...at(740, 500) },
    { id: "L1", kind: "load", label: "Running loads", mode: "current", value: 35, enabled: false, ...at(300, 260) },
    { id: "GB", kind: "ground", label: "Body ground", ...at(320, 440) },
  ];
  const wires: Wire[] = [
    link("W0", "B1.pos", "JBP.a"),
    cable("W1", "Battery + to B+ fuse", "JBP.b", "F1.a", "4 AWG", 0.4, "engine"),
    cable("W2", "B+ cable", "F1.b", "JAB.a", "4 AWG", 1.5, "engine"),
    link("W3", "JAB.b", "A1.out"),
    link("W4", "A1.case", "JAC.a"),
    link("W5", "JAC.b", "GE.t"),
    cable("W6", "Battery ground cable", "GE.t", "JBN.a", "4 AWG", 0.7, "engine"),
    link("W7", "JBN.b", "B1.neg"),
    cable("W8", "Fuse box feed", "JBP.b", "L1.pos", "8 AWG", 2, "cabin"),
    cable("W9", "Load return", "L1.neg", "GB.t", "10 AWG", 0.5, "cabin"),
    { id: "W10", label: "Body-to-engine strap", from: "GB.t", to: "GE.t", resistanceOhm: 0.0015 },
  ];
  if (batteries === 2) {
    components.push({ id: "B2", kind: "battery", label: "Battery 2", openCircuitVoltage: scale(12.6, systemVoltage), internalResistance: 0.006, ...at(-200, 240) });
    wires.push(cable("W11", "Positive interconnect", "B1.pos", "B2.pos", "2/0 AWG", 0.6, "engine"), cable("W12", "Negative interconnect", "B1.neg", "B2.neg", "2/0 AWG", 0.6, "engine"));
  }
  return {
    schema: "ampwright.circuit/1",
    name: batteries === 2 ? "Dual-battery charging circuit" : "Charging circuit",
    systemVoltage,
    ambientC: 25,
    components,
    wires,
    states: [
      { id: "charge", name: "Charging at idle, loads on", set: { A1: { enabled: true }, L1: { enabled: true } } },
      { id: "koeo", name: "Key on, engine off", set: { L1: { enabled: true, value: 10 } } },
    ],
  };
}

function starting(systemVoltage: number): CircuitDocument {
  return {
    schema: "ampwright.circuit/1",
    name: "Starting circuit",
    systemVoltage,
    ambientC: 25,
    components: [
      { id: "B1", kind: "battery", label: "Battery", openCircuitVoltage: scale(12.6, systemVoltage), internalResistance: 0.006, ...at(0, 120) },
      joint("JBP", "Battery + post to clamp", 0, -60),
      joint("JST", "Starter B+ stud", 280, -60),
      { id: "M1", kind: "starter", label: "Starter motor", current: 200, enabled: false, ...at(520, 40) },
      joint("JSM", "Starter mounting", 520, 220),
      { id: "GE", kind: "ground", label: "Engine block", ...at(540, 380) },
      joint("JBN", "Battery - post to clamp", 0, 300),
    ],
    wires: [
      link("W0", "B1.pos", "JBP.a"),
      cable("W1", "Starter positive cable", "JBP.b", "JST.a", "2/0 AWG", 1.5, "engine"),
      link("W2", "JST.b", "M1.in"),
      link("W3", "M1.case", "JSM.a"),
      link("W4", "JSM.b", "GE.t"),
      cable("W5", "Battery ground cable", "GE.t", "JBN.a", "2/0 AWG", 0.8, "engine"),
      link("W6", "JBN.b", "B1.neg"),
    ],
    states: [{ id: "crank", name: "Cranking", set: { M1: { enabled: true } } }],
  };
}

function accessory(systemVoltage: number): CircuitDocument {
  return {
    schema: "ampwright.circuit/1",
    name: "Added accessory feed",
    systemVoltage,
    ambientC: 25,
    components: [
      { id: "B1", kind: "battery", label: "Battery", openCircuitVoltage: scale(12.6, systemVoltage), internalResistance: 0.006, ...at(0, 100) },
      { id: "F1", kind: "fuse", label: "Accessory fuse at the battery", rating: 30, resistance: 0.002, ...at(240, 0) },
      { id: "S1", kind: "switch", label: "Accessory switch", closed: true, contactResistance: 0.002, ...at(480, 0) },
      { id: "L1", kind: "load", label: "Light bar", mode: "current", value: 20, enabled: false, ...at(720, 80) },
      { id: "GR", kind: "ground", label: "Ground stud at the load", ...at(740, 280) },
      { id: "GE", kind: "ground", label: "Battery ground point", ...at(20, 300) },
    ],
    wires: [
      cable("W1", "Fused feed at the battery", "B1.pos", "F1.a", "10 AWG", 0.3, "engine"),
      cable("W2", "Feed to the switch", "F1.b", "S1.a", "10 AWG", 2, "cabin"),
      cable("W3", "Switch to the load", "S1.b", "L1.pos", "10 AWG", 3.5, "underbody"),
      cable("W4", "Load ground", "L1.neg", "GR.t", "10 AWG", 0.4, "underbody"),
      { id: "W5", label: "Chassis return", from: "GR.t", to: "GE.t", resistanceOhm: 0.003 },
      cable("W6", "Battery ground cable", "GE.t", "B1.neg", "4 AWG", 0.6, "engine"),
    ],
    states: [{ id: "on", name: "Accessory on", set: { L1: { enabled: true } } }],
  };
}

export const TEMPLATES: Template[] = [
  { id: "empty", name: "Empty", summary: "A blank canvas at the job's system voltage.", build: (v) => empty("New circuit", v) },
  { id: "charging", name: "Single-battery charging circuit", summary: "Battery, B+ fuse and cable, alternator with its mounting as the ground path, running loads.", build: (v) => charging(v, 1) },
  { id: "dual-charging", name: "Dual-battery charging circuit", summary: "The charging circuit with a second battery in parallel.", build: (v) => charging(v, 2) },
  { id: "starting", name: "Starting circuit", summary: "Battery, starter cable, starter and its mounting, with a cranking state.", build: starting },
  { id: "accessory", name: "Added accessory feed", summary: "A fused, switched feed to a load with a chassis return.", build: accessory },
];
