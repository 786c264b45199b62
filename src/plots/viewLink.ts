/**
 * One camera orientation shared by the Re ρ and Im ρ canvases, so turning one turns both and
 * the two charts stay comparable. Plain subscribe/set; no three.js in here.
 */
export interface View {
  /** Around the vertical axis, radians (three.js Spherical θ). */
  azimuth: number;
  /** From the vertical axis, radians (three.js Spherical φ). */
  polar: number;
  distance: number;
}

export const DEFAULT_VIEW: View = { azimuth: 0.62, polar: 1.1, distance: 9.3 };
export const DISTANCE_RANGE = { min: 4.5, max: 16 } as const;
const POLAR_RANGE = { min: 0.15, max: Math.PI / 2 + 0.35 };
const SAME = 1e-6;

type Listener = (view: View, from: string) => void;

export interface ViewLink {
  get(): View;
  set(view: View, from: string): void;
  subscribe(listener: Listener): () => void;
  turn(radians: number): void;
  tilt(radians: number): void;
  zoom(factor: number): void;
  reset(): void;
}

export function createViewLink(initial: View = DEFAULT_VIEW): ViewLink {
  let current = { ...initial };
  const listeners = new Set<Listener>();
  const set = (view: View, from: string) => {
    const next = clampView(view);
    if (Math.abs(next.azimuth - current.azimuth) < SAME && Math.abs(next.polar - current.polar) < SAME && Math.abs(next.distance - current.distance) < SAME) return;
    current = next;
    for (const l of listeners) l(current, from);
  };
  return {
    get: () => current,
    set,
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    turn: (r) => set({ ...current, azimuth: current.azimuth + r }, "toolbar"),
    tilt: (r) => set({ ...current, polar: current.polar + r }, "toolbar"),
    zoom: (f) => set({ ...current, distance: current.distance / f }, "toolbar"),
    reset: () => set({ ...initial }, "toolbar"),
  };
}

function clampView(v: View): View {
  const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));
  return {
    azimuth: v.azimuth,
    polar: clamp(v.polar, POLAR_RANGE.min, POLAR_RANGE.max),
    distance: clamp(v.distance, DISTANCE_RANGE.min, DISTANCE_RANGE.max),
  };
}
