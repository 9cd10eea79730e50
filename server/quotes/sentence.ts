/**
 * Closes a sentence that may end in a name the user typed: "Buoy Co." already carries its full
 * stop, so none is added ("… Buoy Co.." was printed before). Also leaves "!" and "?" alone.
 */
export function endSentence(text: string): string {
  const trimmed = text.trimEnd();
  return /[.!?…]["”’)]?$/.test(trimmed) ? trimmed : `${trimmed}.`;
}
