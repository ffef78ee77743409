import { z } from 'zod';

export const roleSchema = z.enum(['owner', 'designer', 'programmer', 'art_lead'], {
  error: 'Pick a role: owner, designer, programmer or art lead.',
});
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  designer: 'Designer',
  programmer: 'Programmer',
  art_lead: 'Art lead',
};
