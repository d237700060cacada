/** The product's cases the benchmark measures, each beside a bare twin serving its exact bytes. */
export interface ProductCase {
  /** Short name, also the bare twins' path: /bare/<key>. */
  key: string;
  name: string;
  method: 'GET' | 'POST';
  path: string;
  body?: unknown;
}

export const productCases: ProductCase[] = [
  {
    key: 'search',
    name: 'catalogue search q=brass',
    method: 'GET',
    path: '/api/v1/alloys?q=brass',
  },
  {
    key: 'filter',
    name: 'catalogue filter, sorted',
    method: 'GET',
    path: '/api/v1/alloys?family=aluminium&sort=-conductivity',
  },
  {
    key: 'match',
    name: 'Match (28 %IACS, 8.53 g/cm³)',
    method: 'POST',
    path: '/api/v1/match',
    body: { conductivity: { value: 28, unit: '%IACS' }, density: { value: 8.53, unit: 'g/cm3' } },
  },
];

/** Ports of the three servers bench/servers.ts starts. */
export interface BenchPorts {
  product: number;
  /** Express with the product's compression setting, answering each case's captured bytes. */
  express: number;
  /** node:http answering the same bytes: the floor under any framework. */
  node: number;
  /** Bytes of each case's answer, as captured at start-up. */
  bytes: Record<string, number>;
}
