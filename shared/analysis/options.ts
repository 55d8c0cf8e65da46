// Options of a pattern check, validated once here for the command line, the API and the worker.
import { z } from 'zod';

const positiveMetres = (label: string, max: number) =>
  z
    .number({ error: `${label} must be a number of metres.` })
    .positive(`${label} must be more than 0 m.`)
    .max(max, `${label} must be at most ${max} m.`);

export const zoneOptionsSchema = z
  .object({
    /** Sightings per hectare at which the density surface becomes a zone. */
    densityThresholdPerHa: z.number().positive('The zone density threshold must be more than 0 sightings per ha.').optional(),
    /** Used when no per-hectare threshold is set: this share of the surface's maximum. */
    shareOfMax: z
      .number()
      .gt(0, 'The share of the maximum density must be more than 0.')
      .max(1, 'The share of the maximum density must be at most 1.')
      .default(0.5),
    marginM: z.number().min(0, 'The zone margin cannot be negative.').max(500, 'The zone margin must be at most 500 m.').default(10),
    minZoneAreaM2: z
      .number()
      .min(0, 'The smallest zone area cannot be negative.')
      .max(10_000_000, 'The smallest zone area must be at most 1,000 ha.')
      .default(500),
    /** Propose zones only when the verdict is clustered: spot treatment of an evenly spread pest is a miss. */
    onlyWhenClustered: z.boolean().default(true),
    /** The pest's action threshold as a mean count per stop, in the pest's own unit; without it zones follow relative risk. */
    actionThreshold: z.number().positive('The action threshold must be more than 0.').optional(),
    /** The unit of counts and threshold, e.g. "aphids per plant", for the zone notes. */
    unit: z.string().min(1).max(80).optional(),
  })
  .strict();

export const analysisOptionsSchema = z
  .object({
    /** Coordinates are already planar metres; otherwise WGS 84 longitude/latitude projected to UTM. */
    planar: z.boolean().default(false),
    cellSizeM: positiveMetres('The quadrat cell size', 100_000).optional(),
    grid: z
      .object({
        nx: z
          .number()
          .int('Grid columns must be a whole number.')
          .min(1, 'The grid needs at least 1 column.')
          .max(1000, 'The grid can have at most 1000 columns.'),
        ny: z.number().int('Grid rows must be a whole number.').min(1, 'The grid needs at least 1 row.').max(1000, 'The grid can have at most 1000 rows.'),
      })
      .strict()
      .optional(),
    slivers: z.enum(['merge', 'keep', 'drop'], { error: 'Slivers must be merge, keep or drop.' }).default('merge'),
    radiiM: z
      .array(positiveMetres('Each Ripley radius', 100_000))
      .min(1, 'Give at least one Ripley radius.')
      .max(200, 'Give at most 200 Ripley radii.')
      .transform((radii) => [...new Set(radii)].sort((a, b) => a - b))
      .optional(),
    ripleyCorrection: z.enum(['isotropic', 'border'], { error: 'The Ripley correction must be isotropic or border.' }).default('isotropic'),
    simulations: z
      .number()
      .int('Simulations must be a whole number.')
      .min(0, 'Simulations cannot be negative.')
      .max(99_999, 'Simulations must be at most 99,999.')
      .default(999),
    seed: z.union([z.number().int('The seed must be a whole number or a text.'), z.string().min(1).max(200)]).default(1),
    alpha: z.number().gt(0, 'The significance level must be more than 0.').max(0.5, 'The significance level must be at most 0.5.').default(0.05),
    kernel: z.enum(['quartic', 'gaussian'], { error: 'The kernel must be quartic or gaussian.' }).default('quartic'),
    bandwidthM: positiveMetres('The bandwidth', 100_000).optional(),
    densityCellSizeM: positiveMetres('The density cell size', 10_000).optional(),
    densityEdgeCorrection: z.boolean().default(true),
    areaBasis: z.enum(['boundary', 'bbox', 'hull', 'custom'], { error: 'The area basis must be boundary, bbox, hull or custom.' }).default('boundary'),
    customAreaM2: z.number().positive('The custom area must be more than 0 m².').max(1e11, 'The custom area must be at most 10,000,000 ha.').optional(),
    /** Under this many sightings the verdict is "too few": ten is our default, the fewest at which the
     * Monte Carlo test has useful power against a single patch. */
    minSightings: z
      .number()
      .int('The minimum number of sightings must be a whole number.')
      .min(2, 'The minimum number of sightings must be at least 2.')
      .max(100_000)
      .default(10),
    /** Distance band for Moran's I and Gi*; default: the largest nearest-neighbour distance among the stops. */
    moranBandM: positiveMetres('The Moran distance band', 100_000).optional(),
    /** Same-stop radius: sightings of one walk closer than this are one stop; 0 turns merging off; default max(5 m, stated GPS accuracy). */
    stopRadiusM: z
      .number({ error: 'The same-stop radius must be a number of metres.' })
      .min(0, 'The same-stop radius cannot be negative.')
      .max(200, 'The same-stop radius must be at most 200 m.')
      .optional(),
    /** Above this share of stops with the pest the verdict is "everywhere": a whole-field decision (our rule: most stops). */
    everywhereShare: z.number().gt(0, 'The everywhere share must be more than 0.').max(1, 'The everywhere share must be at most 1.').default(0.5),
    /** Sightings this far outside the boundary still count, moved onto it: GPS error at the headland (common practice: a few metres). */
    boundaryToleranceM: z.number().min(0, 'The boundary tolerance cannot be negative.').max(50, 'The boundary tolerance must be at most 50 m.').default(5),
    zones: zoneOptionsSchema.default({ shareOfMax: 0.5, marginM: 10, minZoneAreaM2: 500, onlyWhenClustered: true }),
  })
  .strict()
  .superRefine((options, context) => {
    if (options.cellSizeM !== undefined && options.grid !== undefined) {
      context.addIssue({ code: 'custom', path: ['grid'], message: 'Give either a quadrat cell size or a grid, not both.' });
    }
    if (options.areaBasis === 'custom' && options.customAreaM2 === undefined) {
      context.addIssue({ code: 'custom', path: ['customAreaM2'], message: 'The custom area basis needs an area in m².' });
    }
  });

export type AnalysisOptions = z.output<typeof analysisOptionsSchema>;
export type AnalysisOptionsInput = z.input<typeof analysisOptionsSchema>;
export type ZoneOptions = z.output<typeof zoneOptionsSchema>;
