/** The parts of astronomia (a port of Meeus' algorithms, shipped without types) the tests use. */
declare module 'astronomia' {
  interface Coord {
    readonly ra: number;
    readonly dec: number;
  }
  export const base: { Coord: new (ra: number, dec: number) => Coord };
  /** Mean sidereal time at Greenwich in seconds of time [0, 86400). */
  export const sidereal: { mean(jd: number): number };
  /** Hour angle in radians at which a body at declination δ reaches altitude h0; throws when it never does. */
  export const rise: { hourAngle(latRad: number, h0Rad: number, decRad: number): number };
  export const angle: { sep(c1: Coord, c2: Coord): number; sepHav(c1: Coord, c2: Coord): number };
  export const julian: { DateToJD(date: Date): number };
}
