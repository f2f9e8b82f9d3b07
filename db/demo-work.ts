/**
 * The demo's work: jobs on the invented vehicles of db/demo.ts, their circuits and the readings taken on them.
 * Every name and number is invented for the story (a corroded alternator bracket on Unit 14, a weak battery in
 * Unit 31's bank, an upfit on a customer's van, and a class's bench trainer).
 */
import { BUILT_IN_PLANS } from "@/lib/diagnosis/plans";
import type { CircuitDocument } from "@/lib/circuit";
import type { SizingInputs } from "@/lib/conductors/sizing-form";

/** Lays a demo circuit out on the canvas (grid of 20): positions by component id. */
function place(doc: CircuitDocument, at: Record<string, [number, number]>): CircuitDocument {
  return { ...doc, components: doc.components.map((c) => (at[c.id] ? { ...c, position: { x: at[c.id][0], y: at[c.id][1] } } : c)) };
}

const joint = (id: string, label: string, resistance: number) => ({ id, kind: "joint" as const, label, resistance });
const link = (id: string, from: string, to: string) => ({ id, from, to, resistanceOhm: 0 });

/** Unit 14: one battery, a 160 A alternator whose mounting (its ground path) has corroded. */
export const pickupCharging: CircuitDocument = place(
  {
  schema: "ampwright.circuit/1",
  name: "Charging circuit",
  systemVoltage: 12,
  ambientC: 30,
  components: [
    { id: "B1", kind: "battery", label: "Battery (750 CCA)", openCircuitVoltage: 12.45, internalResistance: 0.008, capacityAh: 70, cca: 750, position: { x: 0, y: 200 } },
    joint("JBP", "Battery + post to clamp", 0.0002),
    joint("JBN", "Battery - post to clamp", 0.0002),
    { id: "F1", kind: "fuse", label: "B+ fuse (250 A)", rating: 250, resistance: 0.0003, position: { x: 200, y: 60 } },
    joint("JAB", "Alternator B+ stud nut", 0.0004),
    { id: "A1", kind: "alternator", label: "Alternator (160 A)", regulatedVoltage: 14.4, ratedCurrent: 160, enabled: false, position: { x: 480, y: 120 } },
    joint("JAC", "Alternator mounting bracket", 0.035),
    { id: "GE", kind: "ground", label: "Engine block", position: { x: 480, y: 320 } },
    { id: "L1", kind: "load", label: "Headlamps, blower, rear defrost", mode: "power", value: 420, enabled: false, position: { x: 200, y: 420 } },
    { id: "GB", kind: "ground", label: "Body ground stud", position: { x: 200, y: 520 } },
  ],
  wires: [
    link("W0", "B1.pos", "JBP.a"),
    { id: "W1", label: "Battery + to B+ fuse", from: "JBP.b", to: "F1.a", size: "4 AWG", material: "copper", lengthM: 0.4, zone: "engine" },
    { id: "W2", label: "B+ cable", from: "F1.b", to: "JAB.a", size: "4 AWG", material: "copper", lengthM: 1.6, zone: "engine" },
    link("W3", "JAB.b", "A1.out"),
    link("W4", "A1.case", "JAC.a"),
    link("W5", "JAC.b", "GE.t"),
    { id: "W6", label: "Battery ground cable", from: "GE.t", to: "JBN.a", size: "4 AWG", material: "copper", lengthM: 0.7, zone: "engine" },
    link("W7", "JBN.b", "B1.neg"),
    { id: "W8", label: "Fuse box feed", from: "JBP.b", to: "L1.pos", size: "8 AWG", material: "copper", lengthM: 2, zone: "cabin" },
    { id: "W9", label: "Load return", from: "L1.neg", to: "GB.t", size: "10 AWG", material: "copper", lengthM: 0.5, zone: "cabin" },
    { id: "W10", label: "Body-to-engine strap", from: "GB.t", to: "GE.t", resistanceOhm: 0.0015 },
  ],
  states: [
    { id: "charge", name: "Charging at idle, loads on", set: { A1: { enabled: true }, L1: { enabled: true } } },
    { id: "koeo", name: "Key on, engine off", set: { L1: { enabled: true, value: 120 } } },
  ],
  },
  { B1: [40, 240], JBP: [40, 60], F1: [320, 60], JAB: [600, 60], A1: [860, 160], JAC: [860, 340], GE: [880, 540], JBN: [40, 420], L1: [340, 240], GB: [360, 580] },
);

/** Unit 31: three batteries in parallel feeding the starter; the third battery is weak. */
export const tractorStarting: CircuitDocument = place(
  {
  schema: "ampwright.circuit/1",
  name: "Starting circuit",
  systemVoltage: 12,
  ambientC: -5,
  components: [
    { id: "B1", kind: "battery", label: "Battery 1", openCircuitVoltage: 12.55, internalResistance: 0.005, capacityAh: 100, cca: 950 },
    { id: "B2", kind: "battery", label: "Battery 2", openCircuitVoltage: 12.52, internalResistance: 0.005, capacityAh: 100, cca: 950 },
    { id: "B3", kind: "battery", label: "Battery 3", openCircuitVoltage: 12.2, internalResistance: 0.014, capacityAh: 100, cca: 950 },
    joint("JST", "Starter B+ stud", 0.0003),
    { id: "M1", kind: "starter", label: "Starter", current: 650, enabled: false },
    joint("JSM", "Starter mounting", 0.0002),
    { id: "GE", kind: "ground", label: "Engine block" },
    joint("JFG", "Frame ground bolt", 0.0006),
    { id: "GF", kind: "ground", label: "Frame rail at the battery box" },
  ],
  wires: [
    { id: "WP12", label: "Positive interconnect 1-2", from: "B1.pos", to: "B2.pos", size: "2/0 AWG", lengthM: 0.5, zone: "underbody" },
    { id: "WP23", label: "Positive interconnect 2-3", from: "B2.pos", to: "B3.pos", size: "2/0 AWG", lengthM: 0.5, zone: "underbody" },
    { id: "WN12", label: "Negative interconnect 1-2", from: "B1.neg", to: "B2.neg", size: "2/0 AWG", lengthM: 0.5, zone: "underbody" },
    { id: "WN23", label: "Negative interconnect 2-3", from: "B2.neg", to: "B3.neg", size: "2/0 AWG", lengthM: 0.5, zone: "underbody" },
    { id: "WP", label: "Starter positive cable", from: "B1.pos", to: "JST.a", size: "4/0 AWG", lengthM: 2.4, zone: "underbody" },
    link("WPS", "JST.b", "M1.in"),
    link("WMS", "M1.case", "JSM.a"),
    link("WME", "JSM.b", "GE.t"),
    { id: "WEF", label: "Engine-to-frame strap", from: "GE.t", to: "GF.t", resistanceOhm: 0.0004 },
    { id: "WG", label: "Battery ground cable", from: "GF.t", to: "JFG.a", size: "4/0 AWG", lengthM: 1.2, zone: "underbody" },
    link("WGB", "JFG.b", "B1.neg"),
  ],
  states: [{ id: "crank", name: "Cranking, cold engine", set: { M1: { enabled: true } } }],
  },
  { B1: [0, 0], B2: [0, 180], B3: [0, 360], JST: [280, 0], M1: [520, 100], JSM: [520, 280], GE: [540, 440], JFG: [280, 440], GF: [300, 580] },
);

/** The customer's van: a winch and an inverter added on the existing battery, with their own feeds and fuses. */
export const vanUpfit: CircuitDocument = place(
  {
  schema: "ampwright.circuit/1",
  name: "Winch and inverter feeds",
  systemVoltage: 12,
  ambientC: 25,
  components: [
    { id: "B1", kind: "battery", label: "Main battery", openCircuitVoltage: 12.65, internalResistance: 0.006, capacityAh: 80, cca: 800 },
    { id: "A1", kind: "alternator", label: "Alternator (180 A)", regulatedVoltage: 14.2, ratedCurrent: 180, enabled: false },
    { id: "GE", kind: "ground", label: "Engine block" },
    { id: "GF", kind: "ground", label: "Frame rail, front" },
    { id: "FW", kind: "fuse", label: "Winch breaker (300 A)", rating: 300, resistance: 0.0002 },
    { id: "SW", kind: "switch", label: "Winch isolator", closed: true, contactResistance: 0.0003 },
    { id: "MW", kind: "load", label: "Winch (pulling)", mode: "current", value: 280, enabled: false },
    { id: "FI", kind: "fuse", label: "Inverter fuse (200 A)", rating: 200, resistance: 0.0003 },
    { id: "LI", kind: "load", label: "Inverter (1,500 W)", mode: "power", value: 1650, enabled: false },
    { id: "GR", kind: "ground", label: "Inverter ground stud, rear" },
  ],
  wires: [
    { id: "WA", label: "Alternator B+ cable", from: "A1.out", to: "B1.pos", size: "2 AWG", lengthM: 1.4, zone: "engine" },
    link("WAC", "A1.case", "GE.t"),
    { id: "WBG", label: "Battery ground cable", from: "B1.neg", to: "GE.t", size: "2 AWG", lengthM: 0.6, zone: "engine" },
    { id: "WEF", label: "Engine-to-frame strap", from: "GE.t", to: "GF.t", resistanceOhm: 0.0006 },
    { id: "WW1", label: "Winch feed", from: "B1.pos", to: "FW.a", size: "2/0 AWG", lengthM: 0.3, zone: "engine" },
    { id: "WW2", label: "Winch feed to bumper", from: "FW.b", to: "SW.a", size: "2/0 AWG", lengthM: 1.5, zone: "underbody" },
    link("WW3", "SW.b", "MW.pos"),
    { id: "WWG", label: "Winch ground", from: "MW.neg", to: "GF.t", size: "2/0 AWG", lengthM: 1.2, zone: "underbody" },
    { id: "WI1", label: "Inverter fuse at battery", from: "B1.pos", to: "FI.a", size: "1/0 AWG", lengthM: 0.3, zone: "engine" },
    { id: "WI2", label: "Inverter feed to cargo area", from: "FI.b", to: "LI.pos", size: "1/0 AWG", lengthM: 5.2, zone: "underbody" },
    { id: "WIG", label: "Inverter ground", from: "LI.neg", to: "GR.t", size: "1/0 AWG", lengthM: 0.5, zone: "cabin" },
    { id: "WBF", label: "Body to frame, rear", from: "GR.t", to: "GF.t", resistanceOhm: 0.0012 },
  ],
  states: [
    { id: "winch", name: "Winching, engine running", set: { A1: { enabled: true }, MW: { enabled: true } } },
    { id: "inverter", name: "Inverter at full load, engine idling", set: { A1: { enabled: true }, LI: { enabled: true } } },
  ],
  },
  { A1: [0, 0], B1: [0, 200], GE: [20, 400], GF: [300, 520], FW: [240, 120], SW: [460, 120], MW: [700, 120], FI: [240, 300], LI: [460, 300], GR: [720, 320] },
);

/** The class's bench trainer: a battery, an alternator on a drive motor and removable joints to break on purpose. */
export const benchTrainer: CircuitDocument = place(
  {
  schema: "ampwright.circuit/1",
  name: "Bench trainer B, charging",
  systemVoltage: 12,
  ambientC: 22,
  components: [
    { id: "B1", kind: "battery", label: "Bench battery", openCircuitVoltage: 12.6, internalResistance: 0.01, capacityAh: 60 },
    { id: "A1", kind: "alternator", label: "Bench alternator (90 A)", regulatedVoltage: 14.3, ratedCurrent: 90, enabled: false },
    joint("JP", "Removable joint, positive side", 0.0005),
    joint("JN", "Removable joint, ground side", 0.0005),
    { id: "L1", kind: "load", label: "Lamp bank", mode: "resistance", value: 0.4, enabled: false },
    { id: "G1", kind: "ground", label: "Bench ground bar" },
  ],
  wires: [
    { id: "W1", label: "B+ lead", from: "A1.out", to: "JP.a", size: "6 AWG", lengthM: 1.2, zone: "cabin" },
    { id: "W2", label: "Battery + lead", from: "JP.b", to: "B1.pos", size: "6 AWG", lengthM: 0.6, zone: "cabin" },
    { id: "W3", label: "Alternator ground lead", from: "A1.case", to: "JN.a", size: "6 AWG", lengthM: 1.2, zone: "cabin" },
    { id: "W4", label: "Ground bar to battery -", from: "G1.t", to: "B1.neg", size: "6 AWG", lengthM: 0.6, zone: "cabin" },
    link("W5", "JN.b", "G1.t"),
    { id: "W6", label: "Lamp bank feed", from: "B1.pos", to: "L1.pos", size: "8 AWG", lengthM: 1, zone: "cabin" },
    { id: "W7", label: "Lamp bank return", from: "L1.neg", to: "G1.t", size: "8 AWG", lengthM: 1, zone: "cabin" },
  ],
  states: [{ id: "charge", name: "Charging with the lamp bank on", set: { A1: { enabled: true }, L1: { enabled: true } } }],
  },
  { A1: [0, 0], JP: [260, 0], B1: [520, 100], L1: [520, 300], JN: [260, 220], G1: [280, 400] },
);

/** A student's copy with a joint they loosened on purpose. */
export const studentCopy: CircuitDocument = {
  ...benchTrainer,
  name: "My copy: loosened ground joint",
  components: benchTrainer.components.map((c) => (c.id === "JN" ? { ...c, resistance: 0.02 } : c)),
};

type DemoReading = { stateId: string; positive: string; negative: string; value: number; unit: "V" | "mV"; currentA?: number; note: string; by: string; minutesAgo: number };
type DemoCircuit = { id: string; document: CircuitDocument; earlier?: { document: CircuitDocument; message: string }[]; readings: DemoReading[] };
export type DemoJob = {
  id: string;
  organizationId: string;
  ownerId: string;
  vehicleId: string | null;
  title: string;
  vehicle: string;
  complaint: string;
  status: "open" | "diagnosed" | "repaired" | "closed";
  daysAgo: number;
  circuits: DemoCircuit[];
};

const withoutFault: CircuitDocument = {
  ...pickupCharging,
  components: pickupCharging.components.map((c) => (c.id === "JAC" ? { ...c, resistance: 0.0004 } : c)),
};

export const demoJobs: DemoJob[] = [
  {
    id: "job_demo_unit14",
    organizationId: "org_demo_shop",
    ownerId: "usr_demo_tech",
    vehicleId: "veh_demo_pickup",
    title: "Battery light at idle",
    vehicle: "Unit 14, service pickup (gasoline V6, 160 A alternator)",
    complaint: "Battery light flickers at idle with the headlamps and blower on; battery found low twice this month.",
    status: "diagnosed",
    daysAgo: 2,
    circuits: [
      {
        id: "cir_demo_unit14_charging",
        // First drawn with every joint good; the bracket's resistance was set after the readings pointed at it.
        earlier: [{ document: withoutFault, message: "Drawn from the service manual layout" }],
        document: pickupCharging,
        readings: [
          { stateId: "base", positive: "B1.pos", negative: "B1.neg", value: 12.44, unit: "V", note: "Resting 2 h, posts cleaned", by: "usr_demo_tech", minutesAgo: 2900 },
          { stateId: "charge", positive: "B1.pos", negative: "B1.neg", value: 12.58, unit: "V", currentA: 49, note: "Idle, headlamps + blower high + defrost: barely above resting", by: "usr_demo_tech", minutesAgo: 2880 },
          { stateId: "charge", positive: "A1.out", negative: "B1.pos", value: 0.118, unit: "V", currentA: 49, note: "Positive side", by: "usr_demo_tech", minutesAgo: 2875 },
          { stateId: "charge", positive: "B1.neg", negative: "A1.case", value: 1.69, unit: "V", currentA: 49, note: "Ground side: far over", by: "usr_demo_tech", minutesAgo: 2870 },
          { stateId: "charge", positive: "GE.t", negative: "A1.case", value: 1.68, unit: "V", currentA: 49, note: "Block to case: the bracket", by: "usr_demo_tech", minutesAgo: 2865 },
          { stateId: "charge", positive: "B1.neg", negative: "GE.t", value: 12, unit: "mV", currentA: 15, note: "Battery - to block: fine (clamp on the battery ground cable)", by: "usr_demo_tech", minutesAgo: 2860 },
        ],
      },
    ],
  },
  {
    id: "job_demo_unit31",
    organizationId: "org_demo_shop",
    ownerId: "usr_demo_lead",
    vehicleId: "veh_demo_tractor",
    title: "Slow crank when cold",
    vehicle: "Unit 31, day-cab tractor (diesel, three batteries)",
    complaint: "Cranks slowly below freezing; starts after a jump from the yard truck.",
    status: "open",
    daysAgo: 1,
    circuits: [
      {
        id: "cir_demo_unit31_starting",
        document: tractorStarting,
        readings: [
          { stateId: "base", positive: "B1.pos", negative: "B1.neg", value: 12.49, unit: "V", note: "Bank at rest overnight", by: "usr_demo_lead", minutesAgo: 1500 },
          { stateId: "crank", positive: "B1.pos", negative: "M1.in", value: 0.43, unit: "V", currentA: 650, note: "Positive path while cranking", by: "usr_demo_lead", minutesAgo: 1440 },
        ],
      },
    ],
  },
  {
    id: "job_demo_van",
    organizationId: "org_demo_shop",
    ownerId: "usr_demo_owner",
    vehicleId: "veh_demo_van",
    title: "Winch and inverter upfit",
    vehicle: "Customer van (full-size, 180 A alternator)",
    complaint: "Add a front winch and a 1,500 W inverter in the cargo area; customer wants to run tools from the van.",
    status: "open",
    daysAgo: 0,
    circuits: [{ id: "cir_demo_van_feeds", document: vanUpfit, readings: [] }],
  },
  {
    id: "job_demo_unit14_old",
    organizationId: "org_demo_shop",
    ownerId: "usr_demo_tech",
    vehicleId: "veh_demo_pickup",
    title: "No-start, corroded negative clamp",
    vehicle: "Unit 14, service pickup",
    complaint: "Clicks but does not crank after sitting over a long weekend.",
    status: "closed",
    daysAgo: 60,
    circuits: [],
  },
  {
    id: "job_demo_bench",
    organizationId: "org_demo_class",
    ownerId: "usr_demo_instructor",
    vehicleId: "veh_demo_trainer",
    title: "Worked example: voltage drop on a charging circuit",
    vehicle: "Bench trainer B",
    complaint: "Predict each drop, then measure it: positive side, ground side, then each joint.",
    status: "open",
    daysAgo: 5,
    circuits: [
      {
        id: "cir_demo_bench",
        document: benchTrainer,
        readings: [{ stateId: "charge", positive: "A1.out", negative: "B1.pos", value: 0.25, unit: "V", currentA: 88, note: "Demonstrated in class", by: "usr_demo_instructor", minutesAgo: 7000 }],
      },
    ],
  },
  {
    id: "job_demo_ines",
    organizationId: "org_demo_class",
    ownerId: "usr_demo_student1",
    vehicleId: "veh_demo_trainer",
    title: "Ines: ground-side practice",
    vehicle: "Bench trainer B",
    complaint: "Loosen the ground-side joint, predict the drop, measure it.",
    status: "open",
    daysAgo: 3,
    circuits: [
      {
        id: "cir_demo_ines",
        document: studentCopy,
        readings: [{ stateId: "charge", positive: "B1.neg", negative: "A1.case", value: 1.24, unit: "V", currentA: 58, note: "Joint loosened two turns", by: "usr_demo_student1", minutesAgo: 4300 }],
      },
    ],
  },
  {
    id: "job_demo_theo",
    organizationId: "org_demo_class",
    ownerId: "usr_demo_student2",
    vehicleId: "veh_demo_trainer",
    title: "Theo: positive-side practice",
    vehicle: "Bench trainer B",
    complaint: "Measure the B+ lead's drop at three charging currents.",
    status: "open",
    daysAgo: 3,
    circuits: [{ id: "cir_demo_theo", document: benchTrainer, readings: [] }],
  },
];

/** Sizings the upfitter kept with the van job, as typed on the sizing page (the answers are worked out at load). */
/**
 * A job waiting for the charging-system test plan: drawn as designed (every joint good), with only the resting
 * battery read so far. Following the plan on it finds its fault from the readings a technician enters.
 */
export const demoPlanJobs: DemoJob[] = [
  {
    id: "job_demo_unit27",
    organizationId: "org_demo_shop",
    ownerId: "usr_demo_tech",
    vehicleId: null,
    title: "Battery light, Unit 27",
    vehicle: "Unit 27, parts van (same charging layout as Unit 14)",
    complaint: "Battery light comes on at idle with the lights on; goes out when revved. Run the charging-system test plan.",
    status: "open",
    daysAgo: 0,
    circuits: [
      {
        id: "cir_demo_unit27_charging",
        document: { ...withoutFault, name: "Charging circuit (as designed)" },
        readings: [{ stateId: "base", positive: "B1.pos", negative: "B1.neg", value: 12.58, unit: "V", note: "Resting overnight", by: "usr_demo_tech", minutesAgo: 40 }],
      },
    ],
  },
];

export const demoSizings: { id: string; jobId: string; by: string; title: string; inputs: Partial<SizingInputs>; minutesAgo: number }[] = [
  {
    id: "siz_demo_van_winch",
    jobId: "job_demo_van",
    by: "usr_demo_owner",
    title: "Winch feed to the front bumper",
    inputs: { current: "280 A", length: "1.8 m", circuitClass: "critical", zone: "underbody", insulation: "SGX", duty: "intermittent", onTime: "1 min", period: "10 min" },
    minutesAgo: 50,
  },
  {
    id: "siz_demo_van_inverter",
    jobId: "job_demo_van",
    by: "usr_demo_owner",
    title: "Inverter feed to the cargo area",
    inputs: { current: "137.5 A", length: "5.5 m", circuitClass: "critical", zone: "underbody", insulation: "SGX" },
    minutesAgo: 45,
  },
];

/** What the unit 14 readings proved and what was done: the words the report gives the service writer. */
export const demoOutcomes: { jobId: string; findings: string; repair: string }[] = [
  {
    jobId: "job_demo_unit14",
    findings:
      "Battery 12.44 V at rest (about 74 % charged). Charging at idle with the lights and blower on, the ground side from the battery negative to the alternator case dropped 1.69 V at 49 A, and 1.68 V of that is between the engine block and the alternator case: the mounting bracket joint. Positive side 0.118 V, within limits.",
    repair:
      "Removed the alternator, cleaned the bracket and block faces to bare metal, refitted with new hardware to the maker's torque, and added a 4 AWG ground strap from the case to the block. Charge the battery fully before retesting.",
  },
];

/**
 * A read-only link to the unit 14 report that the demo makes with a known token, so the shared page can be tried
 * at /shared/<token> on a local run. Real links get a random token that is shown once.
 */
export const DEMO_SHARE_TOKEN = "ampwright-demo-unit-14-battery-light-report";

/**
 * The class's published lesson: the bench trainer as the instructor drew it, published twice (the second time with
 * questions), with what the students did with it. Ines's practice job is her copy.
 */
export const demoLesson = {
  id: "lsn_demo_bench",
  organizationId: "org_demo_class",
  sourceCircuitId: "cir_demo_bench",
  publishedBy: "usr_demo_instructor",
  versions: [
    {
      version: 1,
      daysAgo: 5,
      title: "Voltage drop on a charging circuit",
      brief: "Bench trainer B charging at 14.4 V. Predict the drop on the positive side and on the ground side before you measure.",
      questions: [],
    },
    {
      version: 2,
      daysAgo: 4,
      title: "Voltage drop on a charging circuit",
      brief:
        "Bench trainer B charging at 14.4 V. Choose \"Charging\" and colour by voltage drop. Predict the drop on the positive side and on the ground side, then find the joint that does the most harm. Make your own copy and loosen that joint to see what the meter would show.",
      questions: [
        { prompt: "Which cable or joint drops the most voltage while charging, and how much?" },
        { prompt: "Why must current be flowing for a voltage-drop test to mean anything?" },
        { prompt: "What would the battery see if the ground-side joint had ten times its resistance?" },
      ],
    },
  ],
  activity: [
    { userId: "usr_demo_student1", openCount: 4, lastVersion: 2, daysAgo: 3, copyJobId: "job_demo_ines" },
    { userId: "usr_demo_student2", openCount: 1, lastVersion: 2, daysAgo: 2, copyJobId: null },
  ],
};

/**
 * The shop's own test plan: the two drop checks of the charging plan alone, for a fleet's quick check on units
 * whose batteries were just tested. Plans are data, so this is the same shape as the built-in ones.
 */
export const demoShopPlan = {
  id: "pln_demo_fleet_drops",
  organizationId: "org_demo_shop",
  createdBy: "usr_demo_lead",
  plan: {
    id: "fleet-drops",
    name: "Fleet quick check: charging drops",
    complaint: "Battery light on a fleet unit whose battery was tested this week",
    allGood: "Both sides of the charging circuit read good. With the battery already tested, look at the alternator, its drive belt and the lamp circuit, following the vehicle maker's service information.",
    steps: BUILT_IN_PLANS[0]!.steps.filter((s) => s.id === "positive" || s.id === "ground"),
  },
};
