import { fieldChanges } from './field-changes';

describe('fieldChanges', () => {
  it('lists each changed field with both values, compares lists by content, and leaves out what is not given', () => {
    const before = { name: 'Fen link', fourEyes: true, shiftLeadIds: [3, 5], description: 'North Hall to Mill Lane' };
    expect(fieldChanges(before, { name: 'Fen link', fourEyes: false, shiftLeadIds: [3, 5], description: undefined })).toEqual({ fourEyes: { from: true, to: false } });
    expect(fieldChanges(before, { shiftLeadIds: [3] })).toEqual({ shiftLeadIds: { from: [3, 5], to: [3] } });
    expect(fieldChanges(before, {})).toEqual({});
  });
});
