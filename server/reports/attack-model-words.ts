import type { KeySummary, SecuritySummary } from '@shared/analysis';

/** An attack model a key figure is computed under. */
export type AttackModel = SecuritySummary['model'];

/** The key figure each attack model stands for, in words. */
export const KEY_FIGURE_OF_MODEL: Record<AttackModel, string> = {
  collective: 'the finite key estimate, against collective (i.i.d.) attacks',
  general: 'the key length against general attacks (entropy accumulation)',
};

/** The one-line caution that stands beside every key figure of each attack model, in the mail and the PDF alike. */
export const KEY_CAUTION: Record<AttackModel, string> = {
  collective: 'Key figures are estimates against collective (i.i.d.) attacks, not a security certificate; final claims rest on the lab’s own proof, certification and local rules.',
  general:
    'The key length against general attacks is an estimate under the assumptions of entropy accumulation (nothing leaves the labs, settings independent of the devices), not a security certificate; final claims rest on the lab’s own proof, certification and local rules.',
};

/** The caution of the collective-attack figures, which every analysed run shows. */
export const COLLECTIVE_ATTACK_CAUTION = KEY_CAUTION.collective;

/** The cautions of the key figures a result shows: the collective ones always, the general one when computed. */
export function keyCautions(key: KeySummary): string[] {
  return key.generalAttack ? [KEY_CAUTION.collective, KEY_CAUTION.general] : [KEY_CAUTION.collective];
}
