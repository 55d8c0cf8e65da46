// Starting pest library. Thresholds differ by region, crop stage, price and product; admins edit them.
// Each source is the publication the figure is taken from; figures recalled from memory say so.
import type { PestInput } from '../../shared/schemas/pests.ts';

export const pestLibrarySeed: PestInput[] = [
  {
    name: 'Soybean aphid',
    kind: 'insect',
    countUnit: 'aphids per plant',
    actionThreshold: 250,
    thresholdBasis: 'mean',
    thresholdNote: 'Treat at 250 aphids per plant with at least 80 % of plants infested and numbers rising, R1–R5.',
    thresholdSource: 'University of Nebraska–Lincoln CropWatch, 2023',
    active: true,
  },
  {
    name: 'Corn rootworm adults',
    kind: 'insect',
    countUnit: 'beetles per plant',
    actionThreshold: 0.75,
    thresholdBasis: 'mean',
    thresholdNote: 'More than 0.75 beetles per plant in continuous corn signals root protection next year.',
    thresholdSource: 'University of Wisconsin IPM',
    active: true,
  },
  {
    name: 'True armyworm',
    kind: 'insect',
    countUnit: 'larvae per seedling',
    actionThreshold: 2,
    thresholdBasis: 'mean',
    thresholdNote: '2 or more larvae per seedling with spreading defoliation.',
    thresholdSource: 'Ohio State University agronomy newsletter, 2020',
    active: true,
  },
  {
    name: 'Grasshoppers',
    kind: 'insect',
    countUnit: 'grasshoppers per square yard',
    actionThreshold: 8,
    thresholdBasis: 'mean',
    thresholdNote: '8 per square yard inside the field; 21–40 per square yard in margins.',
    thresholdSource: 'South Dakota State University Extension',
    active: true,
  },
  {
    name: 'Giant ragweed',
    kind: 'weed',
    countUnit: 'plants per square metre',
    actionThreshold: 1,
    thresholdBasis: 'mean',
    thresholdNote:
      'Treat before plants reach 6–10 inches tall. The per-area figure of 1 is our starting point (recalled from memory, not from the source); adjust it to local guidance.',
    thresholdSource: 'University of Wisconsin pest bulletin (height rule); count figure recalled from memory',
    active: true,
  },
  {
    name: 'Gray leaf spot',
    kind: 'disease',
    countUnit: 'leaves with lesions per plant (third leaf below the ear)',
    actionThreshold: 0.5,
    thresholdBasis: 'incidence',
    thresholdNote:
      'Lesions on the third leaf below the ear at VT–R1 on susceptible hybrids. The 50 % incidence figure is recalled from memory; check local guidance.',
    thresholdSource: 'Kansas State University Research and Extension (stage rule); incidence figure recalled from memory',
    active: true,
  },
];
