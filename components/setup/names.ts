/**
 * What people read instead of the engine's codes: solver methods by their published names, gait patterns by
 * names of our own. The codes stay in the leg setup and the exported profile; only the screens use these.
 */
import type { SolverMethod } from '../../engine/ik/options';

export const SOLVER_METHOD_NAMES: Record<SolverMethod, string> = {
  dls: 'DLS',
  sdls: 'SDLS',
  transpose: 'Jacobian transpose',
  pseudoinverse: 'Pseudoinverse',
  adaptive: 'Adaptive DLS',
  ccd: 'CCD',
};

/** One line under the method chips: what the chosen method does. */
export const SOLVER_METHOD_NOTES: Record<SolverMethod, string> = {
  dls: 'Damped least squares: one damping λ trades reach for calm near full stretch.',
  sdls: 'Selectively damped least squares: damps each direction by how far it would swing the joints.',
  transpose: 'Jacobian transpose: cheap steps along the gradient; needs more iterations.',
  pseudoinverse: 'Pseudoinverse: exact steps, with tiny singular values dropped; can snap near full stretch.',
  adaptive: 'DLS whose damping grows near full stretch (from manipulability) or with the error.',
  ccd: 'Cyclic coordinate descent: one joint at a time, foot to hip. Position only: it does not turn the sole to the ground.',
};

const GAIT_NAMES: Record<string, string> = {
  'biped-walk': 'Two-leg walk',
  'quadruped-walk': 'Four-leg walk',
  'quadruped-trot': 'Four-leg trot',
  'hexapod-tripod': 'Six-leg tripod',
  'hexapod-wave': 'Six-leg wave',
  custom: 'Own phase offsets',
};

/** A gait pattern's name; an unknown code (a newer engine) shows as it is. */
export const gaitName = (code: string) => GAIT_NAMES[code] ?? code;
export const solverMethodName = (code: string) => SOLVER_METHOD_NAMES[code as SolverMethod] ?? code;
