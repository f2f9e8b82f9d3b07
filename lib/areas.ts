/** The product's areas, in the order the navigation shows them. Pages and the header read this one list. */
export type Area = {
  href: string;
  label: string;
  /** One line on what the area is for. */
  summary: string;
  /** What a person will be able to do there, said plainly while the area is being built. */
  coming: string[];
  ready: boolean;
};

export const areas: Area[] = [
  {
    href: "/jobs",
    label: "Jobs",
    summary: "Vehicles in the bay, their complaints, circuits, readings and the write-up.",
    coming: [
      "A list of your shop's jobs with status, vehicle and complaint, searchable from a phone.",
      "Each job keeps its circuits, meter readings, photos and history, so nothing is measured twice.",
      "A report a service writer and a customer can read, printed, as a PDF or by e-mail.",
    ],
    ready: true,
  },
  {
    href: "/workspace",
    label: "Circuits",
    summary: "Sketch a charging or starting circuit and see every voltage, current and drop.",
    coming: [
      "Place batteries, alternators, starters, loads, fuses, joints and grounds; join them with cables.",
      "Switch between cranking, charging, key-on and added-load states and see the solved circuit at once.",
      "Cable resistance from size, material, length and temperature, not guesses.",
    ],
    ready: true,
  },
  {
    href: "/diagnosis",
    label: "Diagnosis",
    summary: "Meter readings laid over the model to find the high-resistance joint.",
    coming: [
      "Guided checks in the order that proves the fault: state of charge, feeds, drops under load.",
      "Each reading compared with what the circuit predicts, with the likely joint named.",
      "A verdict and a repair order, only once feeds, grounds and cables are proven.",
    ],
    ready: true,
  },
  {
    href: "/size",
    label: "Sizing",
    summary: "Cable and fuse for an added load, by current, length and heat.",
    coming: [
      "Type the load, the run length and where the cable goes; get the size, the fuse and the reason.",
      "Every candidate size with its drop, heat and derated ampacity.",
      "A check that the alternator keeps up with the new load at idle.",
    ],
    ready: true,
  },
  {
    href: "/lessons",
    label: "Lessons",
    summary: "Worked circuits an instructor shares with a class to open, explore and copy.",
    coming: [
      "Lessons built from circuits with faults placed on purpose.",
      "Share links for a class; students copy a lesson into their own work.",
      "Predict, measure, compare, conclude: the method, step by step.",
    ],
    ready: true,
  },
];

export function areaByHref(href: string): Area {
  const area = areas.find((a) => a.href === href);
  if (!area) throw new Error(`no area at ${href}`);
  return area;
}
