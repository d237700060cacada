/**
 * One account per role for local use only (printed in the README). The invented Carrow Bay
 * domain uses the reserved .example top-level domain (RFC 2606), so no mail can reach anyone.
 */
export const demoAccounts = [
  {
    email: 'reader@carrowbay.example',
    name: 'Demo reader',
    role: 'reader',
    password: 'reader-demo-2026',
  },
  {
    email: 'integrator@carrowbay.example',
    name: 'Demo integrator',
    role: 'integrator',
    password: 'integrator-demo-2026',
  },
  {
    email: 'curator@carrowbay.example',
    name: 'Demo curator',
    role: 'curator',
    password: 'curator-demo-2026',
  },
  {
    email: 'curator2@carrowbay.example',
    name: 'Second demo curator',
    role: 'curator',
    password: 'curator2-demo-2026',
  },
  {
    email: 'admin@carrowbay.example',
    name: 'Demo admin',
    role: 'admin',
    password: 'admin-demo-2026',
  },
] as const;
