// The cautions every zone notice carries, in the e-mail and on the notice page alike.
export const NOTICE_CAUTIONS = [
  'Read and follow the product label before any treatment: the label is the legal document.',
  'Observe the re-entry interval and the pre-harvest interval stated on the label.',
  'Have the treatment applied by a licensed or certified applicator wherever the law requires one.',
  'Keep buffers to water, wells and other sensitive areas, as the label and local rules set them.',
  'Local regulations and local extension guidance prevail over this notice.',
  'This notice is advice, not a prescription: the decision to treat, and how, stays with you.',
] as const;

/** What the sprayer-ready zone files (task data, shapefile) say wherever they are offered. */
export const MACHINE_FILE_CAUTION =
  'These files mark where to treat, not what to apply: they hold no product and no rate. The product label (the legal document), local regulations and local extension guidance decide the product, rate, re-entry and pre-harvest intervals and buffers; apply through a licensed applicator where the law requires.';
