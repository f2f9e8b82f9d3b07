/**
 * The fictional demo: one shop, one class, their vehicles. Every name here is invented (no real makes,
 * models, people or businesses); later capabilities add their parts to the same story.
 */
export const demoShop = {
  id: "org_demo_shop",
  name: "Larkspur Road Auto Electric",
  slug: "larkspur-road",
  kind: "shop" as const,
};

export const demoClass = {
  id: "org_demo_class",
  name: "Fernmoor Technical Institute, Auto Electrical 210",
  slug: "fernmoor-ae210",
  kind: "class" as const,
};

export const demoVehicles = [
  {
    id: "veh_demo_pickup",
    organizationId: demoShop.id,
    nickname: "Unit 14, service pickup",
    description: "Light pickup, gasoline V6, 160 A alternator, one battery (750 CCA). Complaint: battery light at idle.",
    modelYear: 2019,
    systemVoltage: 12,
    unitNumber: "14",
    odometerKm: 184_220,
  },
  {
    id: "veh_demo_tractor",
    organizationId: demoShop.id,
    nickname: "Unit 31, day-cab tractor",
    description: "Heavy truck, diesel, three batteries in parallel, 200 A alternator. Complaint: slow crank when cold.",
    modelYear: 2016,
    systemVoltage: 12,
    unitNumber: "31",
    odometerKm: 912_400,
  },
  {
    id: "veh_demo_van",
    organizationId: demoShop.id,
    nickname: "Customer van, winch and inverter upfit",
    description: "Full-size van getting a 9,000 lb winch, a 1,500 W inverter and a second battery.",
    modelYear: 2022,
    systemVoltage: 12,
    unitNumber: null,
    odometerKm: 41_870,
  },
  {
    id: "veh_demo_trainer",
    organizationId: demoClass.id,
    nickname: "Bench trainer B",
    description: "Classroom charging-system bench: battery, alternator on a drive motor, starter, removable joints.",
    modelYear: null,
    systemVoltage: 12,
    unitNumber: "B",
    odometerKm: null,
  },
];

/** Demo sign-ins, one person per role (invented people; .example addresses never deliver). */
export const DEMO_PASSWORD = "larkspur-demo-2026";

export const demoPeople = [
  { id: "usr_demo_owner", name: "Dana Ferreira", email: "dana@larkspur.example", org: demoShop.id, role: "owner" },
  { id: "usr_demo_lead", name: "Tobias Venn", email: "tobias@larkspur.example", org: demoShop.id, role: "lead" },
  { id: "usr_demo_tech", name: "Priya Halvorsen", email: "priya@larkspur.example", org: demoShop.id, role: "technician" },
  { id: "usr_demo_writer", name: "Sam Achterberg", email: "sam@larkspur.example", org: demoShop.id, role: "viewer" },
  { id: "usr_demo_instructor", name: "Lena Moravec", email: "lena@fernmoor.example", org: demoClass.id, role: "owner" },
  { id: "usr_demo_assistant", name: "Jonah Pell", email: "jonah@fernmoor.example", org: demoClass.id, role: "lead" },
  { id: "usr_demo_student1", name: "Ines Karlsen", email: "ines@fernmoor.example", org: demoClass.id, role: "student" },
  { id: "usr_demo_student2", name: "Theo Marsh", email: "theo@fernmoor.example", org: demoClass.id, role: "student" },
  { id: "usr_demo_observer", name: "Ruth Osei", email: "ruth@fernmoor.example", org: demoClass.id, role: "viewer" },
] as const;
