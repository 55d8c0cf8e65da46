// clipper-lib ships no type declarations; these cover the offsetting and clipping calls the engine makes.
declare module 'clipper-lib' {
  type IntPoint = { X: number; Y: number };
  type Path = IntPoint[];
  interface PolyTree {
    Total(): number;
  }
  interface ExPolygon {
    outer: Path;
    holes: Path[];
  }
  class Clipper {
    AddPaths(paths: Path[], type: number, closed: boolean): boolean;
    Execute(clipType: number, solution: PolyTree | Path[], subjectFill?: number, clipFill?: number): boolean;
  }
  class ClipperOffset {
    constructor(miterLimit?: number, arcTolerance?: number);
    AddPaths(paths: Path[], joinType: number, endType: number): void;
    Execute(solution: Path[] | PolyTree, delta: number): void;
  }
  const ClipperLib: {
    Clipper: typeof Clipper;
    ClipperOffset: typeof ClipperOffset;
    PolyTree: new () => PolyTree;
    ClipType: { ctIntersection: number; ctUnion: number; ctDifference: number };
    PolyType: { ptSubject: number; ptClip: number };
    PolyFillType: { pftEvenOdd: number; pftNonZero: number };
    JoinType: { jtRound: number };
    EndType: { etOpenRound: number; etClosedPolygon: number };
    JS: { PolyTreeToExPolygons(tree: PolyTree): ExPolygon[] };
  };
  export default ClipperLib;
}
