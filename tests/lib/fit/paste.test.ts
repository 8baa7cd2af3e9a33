import { describe, expect, it } from 'vitest';
import { splitClipboardGrid } from '@/lib/fit/paste';

// Tab-separated text as spreadsheets put it on the clipboard (text/tab-separated-values, with
// the quoting rules of RFC 4180 for cells that hold tabs, line breaks or quotes).
describe('splitClipboardGrid', () => {
  it('splits rows and cells, ignoring the trailing line break', () => {
    expect(splitClipboardGrid('27\t29\t31\n20\t22\t24\n')).toEqual([['27', '29', '31'], ['20', '22', '24']]);
  });

  it('reads Windows line ends and empty cells', () => {
    expect(splitClipboardGrid('1\t\t3\r\n4\t5\t\r\n')).toEqual([['1', '', '3'], ['4', '5', '']]);
  });

  it('unwraps quoted cells with tabs, line breaks and doubled quotes', () => {
    expect(splitClipboardGrid('"a\tb"\t"say ""12"""\n"two\nlines"\tx')).toEqual([['a\tb', 'say "12"'], ['two\nlines', 'x']]);
  });

  it('takes a single cell literally, quotes and all', () => {
    expect(splitClipboardGrid('12"')).toEqual([['12"']]);
    expect(splitClipboardGrid('')).toEqual([]);
  });
});
