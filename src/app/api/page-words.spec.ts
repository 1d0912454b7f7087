import { PageWords } from './page-words';

describe('PageWords', () => {
  const words = new PageWords();

  it('counts the rows of the page shown among all', () => {
    expect(words.getRangeLabel(0, 25, 60)).toBe('Rows 1 to 25 of 60');
    expect(words.getRangeLabel(2, 25, 60)).toBe('Rows 51 to 60 of 60');
    expect(words.getRangeLabel(1, 1000, 1204)).toBe('Rows 1\u2009001 to 1\u2009204 of 1\u2009204');
  });

  it('says when there is nothing to show, or the page is past the end', () => {
    expect(words.getRangeLabel(0, 25, 0)).toBe('No rows');
    expect(words.getRangeLabel(5, 25, 60)).toBe('Past the last of 60 rows');
  });
});
