// The invented demo scenario's accounts (demo mode only; the password is shown
// on the sign-in page when PLINTH_DEMO=1 and is never used outside the demo).
export const DEMO_PASSWORD = "plinth-demo-2026";

export const demoAccounts = [
  { email: "admin@plinthwise.test", name: "Ines Okafor-Lund", role: "admin", label: "Administrator" },
  { email: "manager@plinthwise.test", name: "Tomasz Achterberg", role: "manager", label: "Project manager" },
  { email: "designer@plinthwise.test", name: "Priya Valcourt", role: "designer", label: "Foundation designer" },
  { email: "checker@plinthwise.test", name: "Henrik Osei-Barros", role: "checker", label: "Independent checker" },
  { email: "vendor@corvane-pumps.test", name: "Lucía Brennagh", role: "vendor", label: "Vendor (Corvane Pumps)" },
  { email: "viewer@plinthwise.test", name: "Mateo Lindqvist", role: "viewer", label: "Client viewer" },
] as const;

export const DEMO_PROJECT_CODE = "WRP-PH1";
export const DEMO_VENDOR_COMPANY = "Corvane Pumps";
