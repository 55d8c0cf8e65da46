// piexifjs ships no types; the parts Patchwise uses (tests, demo seed, bench) are declared here.
declare module 'piexifjs' {
  const piexif: {
    dump(exif: Record<string, unknown>): string;
    insert(exif: string, jpeg: string): string;
    load(jpeg: string): Record<string, Record<number, unknown>>;
    remove(jpeg: string): string;
    ImageIFD: Record<string, number>;
    ExifIFD: Record<string, number>;
    GPSIFD: Record<string, number>;
    TAGS: Record<string, Record<number, { name: string; type: string }>>;
  };
  export default piexif;
}
