/** Colours of the axes in the conventions drawings: x red, y green, z blue (global and local alike). */
export const AXIS_COLORS = { x: '#c62828', y: '#2e7d32', z: '#1565c0', load: '#8a4b08', force: '#6a1b9a' } as const;
