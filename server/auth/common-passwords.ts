/**
 * A short deny-list of the passwords that top the published lists of leaked passwords (NIST
 * SP 800-63B §5.1.1.2 asks verifiers to refuse such values). Compiled from memory of those
 * public lists, lower-cased; only entries of the minimum length or more matter here.
 */
export const commonPasswords = new Set([
  '1234567890', '12345678910', '0123456789', '1111111111', '0000000000', '123456789a', 'qwertyuiop',
  'password1', 'password12', 'password123', 'password1234', 'passw0rd123', 'iloveyou123', 'qwerty1234',
  'qwerty12345', '1q2w3e4r5t', '1qaz2wsx3edc', 'zaq12wsxcde', 'asdfghjkl1', 'football123', 'baseball123',
  'welcome123', 'welcome1234', 'letmein123', 'sunshine123', 'princess123', 'superman123', 'abcdefghij',
  'abc1234567', 'administrator', 'changeme123', 'trustno1234', 'dragon1234', 'monkey1234', 'starwars123',
  'whatever123', 'qazwsxedcrfv', 'michael123', 'jennifer123', 'charlie123', 'computer123', 'internet123',
  'passwordpassword', 'mypassword', 'mypassword1', 'secret1234', 'default123', 'seepwise123', 'gardening1',
  'gardening123', 'tomatoes123', 'ollaolla123',
]);

export function isCommonPassword(password: string): boolean {
  const p = password.toLowerCase();
  if (commonPasswords.has(p)) return true;
  // One character repeated, or a plain ascending run of digits or letters.
  if (/^(.)\1+$/.test(p)) return true;
  return '01234567890123456789'.includes(p) || 'abcdefghijklmnopqrstuvwxyz'.includes(p);
}
