// The invented demo scenario: one advisory business, its people, farms and fields.
// Names and places are made up; boundaries sit in open farmland at coordinates of our choosing.
import type { FarmInput } from '../../shared/schemas/farms.ts';
import type { Role } from '../../shared/schemas/roles.ts';

export const DEMO_PASSWORD = 'patchwise-demo-2026';
export const demoOrganisationName = 'Larkspur Crop Advisory (demo)';

export const demoUsers: Array<{ key: string; name: string; email: string; role: Role }> = [
  { key: 'admin', name: 'Ada Quillfeather', email: 'admin@larkspur.example', role: 'admin' },
  { key: 'adviser', name: 'Bram Oxley', email: 'adviser@larkspur.example', role: 'adviser' },
  { key: 'scout', name: 'Cleo Marchetti', email: 'scout@larkspur.example', role: 'scout' },
  { key: 'grower', name: 'Dov Hartigan', email: 'grower@larkspur.example', role: 'grower' },
];

export const demoFarms: Array<FarmInput & { key: string; growerKey?: string }> = [
  {
    key: 'willowbend',
    name: 'Willowbend Farm',
    growerKey: 'grower',
    contacts: [
      { name: 'Dov Hartigan', email: 'grower@larkspur.example' },
      { name: 'Wren Hartigan', email: 'wren@willowbend.example' },
    ],
  },
  { key: 'stonegate', name: 'Stonegate Acres', contacts: [{ name: 'Isla Penrose', email: 'isla@stonegate.example' }] },
];

// Rectangle of widthM × heightM whose south-west corner is at (lon, lat), in WGS 84.
function rectangle(lon: number, lat: number, widthM: number, heightM: number): number[][] {
  const dLat = heightM / 111_320;
  const dLon = widthM / (111_320 * Math.cos((lat * Math.PI) / 180));
  return [
    [lon, lat],
    [lon + dLon, lat],
    [lon + dLon, lat + dLat],
    [lon, lat + dLat],
    [lon, lat],
  ];
}

export interface DemoField {
  key: 'patchy' | 'even' | 'sparse';
  farmKey: string;
  name: string;
  crop: string;
  season: number;
  boundary: { type: 'MultiPolygon'; coordinates: number[][][][] };
}

export const demoFields: DemoField[] = [
  {
    key: 'patchy',
    farmKey: 'willowbend',
    name: 'North Creek 40',
    crop: 'soybean',
    season: 2026,
    // About 40 ha with a farm pond cut out as a hole.
    boundary: { type: 'MultiPolygon', coordinates: [[rectangle(-98.412, 41.1021, 800, 500), rectangle(-98.4071, 41.1043, 90, 70).reverse()]] },
  },
  {
    key: 'even',
    farmKey: 'willowbend',
    name: 'Schoolhouse Quarter',
    crop: 'corn',
    season: 2026,
    boundary: { type: 'MultiPolygon', coordinates: [[rectangle(-98.3985, 41.1021, 600, 600)]] },
  },
  {
    key: 'sparse',
    farmKey: 'stonegate',
    name: 'Railside Strip',
    crop: 'soybean',
    season: 2026,
    boundary: { type: 'MultiPolygon', coordinates: [[rectangle(-98.421, 41.091, 900, 250)]] },
  },
];
