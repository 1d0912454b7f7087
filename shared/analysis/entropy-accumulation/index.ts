// Key length against general attacks (entropy accumulation): the entry point and its types.
export { generalAttackKeyLength, KeyLengthInputError } from './general-attack-key-length';
export type { DesignedRequest, FixedRequest, GeneralAttackKeyLength, GeneralAttackRequest } from './general-attack-key-length';
export type { KeyLengthParameters } from './key-length-parameters';
