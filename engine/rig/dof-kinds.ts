/**
 * The kinds of leg joint, written once: the leg-mapping schema, the rig model
 * and the IK workspace all read them from here.
 */
export const DOF_KINDS = ['ball', 'hinge', 'universal', 'slider'] as const;
export type DofKind = (typeof DOF_KINDS)[number];

/** Degrees of freedom the solver gives each kind: a ball turns about three axes, a universal two, a hinge and a slider one. */
export const DOF_COUNT: Record<DofKind, number> = { hinge: 1, universal: 2, ball: 3, slider: 1 };

/**
 * How many rotation axes and limit ranges a mapped joint of each kind carries.
 * A ball has no axes and two ranges: swing cone [0, half-angle] and twist.
 */
export const DOF_SHAPE: Record<DofKind, { axes: number; limits: number }> = {
  hinge: { axes: 1, limits: 1 },
  universal: { axes: 2, limits: 2 },
  ball: { axes: 0, limits: 2 },
  slider: { axes: 1, limits: 1 },
};
