// TEXT/MTEXT strings as plain text: MTEXT inline formatting codes and %% control codes removed
// (code list: DXF reference, MTEXT inline codes; TEXT control codes %%d %%p %%c %%u %%o %%%).

export function plainText(raw: string, mtext: boolean): string {
  let s = raw;
  if (mtext) {
    s = s
      .replace(/\\P/g, '\n')
      .replace(/\\~/g, ' ')
      .replace(/\\[ACcFfHhQTWp][^;\\{}]*;/g, '')
      .replace(/\\S([^;]*)[\^/#]([^;]*);/g, '$1/$2')
      .replace(/\\[LlOoKkNX]/g, '')
      .replace(/\\\\/g, '\u0000')
      .replace(/\\\{/g, '\u0002')
      .replace(/\\\}/g, '\u0003')
      .replace(/[{}]/g, '')
      .replace(/\u0002/g, '{')
      .replace(/\u0003/g, '}')
      .replace(/\u0000/g, '\\');
  }
  return s
    .replace(/%%[dD]/g, '°')
    .replace(/%%[pP]/g, '±')
    .replace(/%%[cC]/g, '⌀')
    .replace(/%%[uUoOkK]/g, '')
    .replace(/%%%/g, '%');
}
