import { roleLabels, roleSchema } from '../../schemas/roles';

export const roleChoices = roleSchema.options.map((value) => ({ value, label: roleLabels[value] }));

/** One line on what each role is for, shown beside the invite form. */
export const roleDuties = {
  owner: 'Runs members, plan and billing; can do everything.',
  designer: 'Builds courses, uploads characters, runs trials and dial-ins.',
  programmer: 'Publishes and downloads leg profiles; creates API tokens.',
  art_lead: 'Compares characters and reads every result.',
} as const;
