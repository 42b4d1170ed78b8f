// The demo lab's clients and its queue of received samples: invented companies, people and items, for trying the day plan.
export const DEMO_CLIENTS = [
  { name: 'Harrowgate Power Cooperative', contactName: 'Imogen Vale', contactEmail: 'fuel.lab@harrowgate-power.test', address: '4 Turbine Row, Harrowgate' },
  { name: 'Linnet Valley Pellet Works', contactName: 'Owen Marsh', contactEmail: 'quality@linnet-pellets.test', address: 'Unit 9, Mill Lane Estate, Linnet' },
  { name: 'Sablewick Mills Ltd', contactName: 'Dr. Farah Quill', contactEmail: 'lab@sablewick-mills.test', address: '22 Granary Street, Sablewick' },
] as const

type ClientName = typeof DEMO_CLIENTS[number]['name']

/** What arrived, how long ago (hours), and the library material when the client named one. */
export const DEMO_RECEIPTS: { client: ClientName, reference: string, description: string, material: string | null, hoursAgo: number, condition: string, massG: number }[] = [
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W49-01', description: 'Bituminous blend, ground to < 212 µm, sealed jar', material: 'Client coal KRC-2611 (bituminous blend)', hoursAgo: 124, condition: 'sealed, dry', massG: 250 },
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W49-02', description: 'Bituminous blend, ground to < 212 µm, sealed jar', material: 'Client coal KRC-2611 (bituminous blend)', hoursAgo: 123, condition: 'sealed, dry', massG: 240 },
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W49-03', description: 'Bituminous blend, ground, bag inside tin', material: 'Client coal KRC-2611 (bituminous blend)', hoursAgo: 100, condition: 'bag torn inside intact tin', massG: 310 },
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W49-04', description: 'Heavy fuel oil blend, 250 mL amber bottle', material: 'Marine gas oil MG-9', hoursAgo: 98, condition: 'sealed', massG: 215 },
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W49-05', description: 'Shredded refuse-derived fuel, double bag', material: 'Shredded packaging waste SW-3', hoursAgo: 76, condition: 'double-bagged, slight odour', massG: 520 },
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W49-06', description: 'Bituminous blend, ground, sealed jar', material: 'Client coal KRC-2611 (bituminous blend)', hoursAgo: 52, condition: 'sealed, dry', massG: 260 },
  { client: 'Harrowgate Power Cooperative', reference: 'HPC-W50-01', description: 'Marine gas oil retain, 100 mL bottle', material: 'Marine gas oil MG-9', hoursAgo: 27, condition: 'sealed', massG: 88 },
  { client: 'Linnet Valley Pellet Works', reference: 'LV-P44-A', description: 'Pine pellets, lot P-44, 1 kg bag', material: 'Pine pellets lot P-44', hoursAgo: 118, condition: 'sealed, dry', massG: 1000 },
  { client: 'Linnet Valley Pellet Works', reference: 'LV-P44-B', description: 'Pine pellets, lot P-44, 1 kg bag', material: 'Pine pellets lot P-44', hoursAgo: 118, condition: 'sealed, dry', massG: 980 },
  { client: 'Linnet Valley Pellet Works', reference: 'LV-P45-A', description: 'Pine pellets, lot P-45, 1 kg bag, slightly damp', material: 'Pine pellets lot P-44', hoursAgo: 70, condition: 'bag damp on the outside', massG: 1010 },
  { client: 'Linnet Valley Pellet Works', reference: 'LV-P45-B', description: 'Pine pellets, lot P-45, milled, jar', material: 'Pine pellets lot P-44', hoursAgo: 50, condition: 'sealed', massG: 180 },
  { client: 'Linnet Valley Pellet Works', reference: 'LV-BARK-7', description: 'Bark fines for a new boiler, tub', material: null, hoursAgo: 30, condition: 'tub lid loose', massG: 420 },
  { client: 'Linnet Valley Pellet Works', reference: 'LV-P46-A', description: 'Pine pellets, lot P-46, 1 kg bag', material: 'Pine pellets lot P-44', hoursAgo: 6, condition: 'sealed, dry', massG: 1000 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-OAT-211', description: 'Rolled oat flakes, retail pack', material: 'Rolled oat flakes', hoursAgo: 96, condition: 'sealed pack', massG: 500 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-OAT-212', description: 'Rolled oat flakes, milled, jar', material: 'Rolled oat flakes', hoursAgo: 95, condition: 'sealed', massG: 150 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-OAT-213', description: 'Rolled oat flakes, second mill, jar', material: 'Rolled oat flakes', hoursAgo: 72, condition: 'sealed', massG: 160 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-BRAN-40', description: 'Wheat bran feed, pouch', material: null, hoursAgo: 48, condition: 'pouch resealed by client', massG: 300 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-OAT-214', description: 'Rolled oat flakes, retail pack', material: 'Rolled oat flakes', hoursAgo: 26, condition: 'sealed pack', massG: 500 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-OAT-215', description: 'Rolled oat flakes, milled, jar', material: 'Rolled oat flakes', hoursAgo: 8, condition: 'sealed', massG: 140 },
  { client: 'Sablewick Mills Ltd', reference: 'SM-OAT-216', description: 'Rolled oat flakes, milled, jar', material: 'Rolled oat flakes', hoursAgo: 3, condition: 'sealed', massG: 145 },
]
