// Upload limits, configurable from the environment (megabytes and counts).
const number = (value: string | undefined, fallback: number) => {
  const n = Number(value);
  return Number.isFinite(n) && n > 0 ? n : fallback;
};

export function photoLimits(env: NodeJS.ProcessEnv = process.env) {
  const maxFileMb = number(env.PHOTO_MAX_FILE_MB, 25);
  const maxRequestMb = number(env.PHOTO_MAX_REQUEST_MB, 200);
  return {
    maxFileMb,
    maxFileBytes: Math.round(maxFileMb * 1024 * 1024),
    maxFiles: Math.floor(number(env.PHOTO_MAX_FILES, 20)),
    maxRequestMb,
    maxRequestBytes: Math.round(maxRequestMb * 1024 * 1024),
    // A decoded photo takes 4 bytes a pixel: 100 MP is 400 MB of memory for one thumbnail, so larger ones are refused.
    maxMegapixels: number(env.PHOTO_MAX_MEGAPIXELS, 100),
  };
}
