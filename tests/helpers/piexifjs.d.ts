// piexifjs 1.0.6 ships no types; the few calls the tests use.
declare module 'piexifjs' {
  const piexif: {
    ImageIFD: Record<string, number>;
    GPSIFD: Record<string, number>;
    dump(exif: Record<string, Record<number, unknown>>): string;
    insert(exif: string, jpegBinary: string): string;
  };
  export default piexif;
}
