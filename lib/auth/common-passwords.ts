// Passwords that appear at the top of every leaked-password list, and words a bonsai club's
// members would reach for first. Compared case-insensitively. From memory.
export const commonPasswords = new Set([
  '12345678', '123456789', '1234567890', '87654321', '11111111', '00000000', '12341234', '11223344',
  '12121212', '123123123', '1q2w3e4r', '1qaz2wsx', 'qwertyui', 'qwertyuiop', 'asdfghjk', 'zxcvbnm1',
  'password', 'password1', 'password12', 'password123', 'passw0rd', 'p@ssw0rd', 'p@ssword', 'letmein1',
  'letmein!', 'welcome1', 'welcome123', 'iloveyou', 'sunshine', 'princess', 'football', 'baseball',
  'superman', 'starwars', 'whatever', 'trustno1', 'dragon12', 'monkey12', 'master12', 'shadow12',
  'michelle', 'jennifer', 'computer', 'internet', 'changeme', 'changeme1', 'secret12', 'abcd1234',
  'abc12345', 'qwerty12', 'qwerty123', 'qazwsxedc', 'aa123456', 'admin123', 'administrator', 'login123',
  'default1', 'freedom1', 'mustang1', 'access14', 'charlie1', 'donald12', 'hello123', 'hunter12',
  'blink182', 'liverpool', 'chelsea1', 'arsenal1', 'samsung1', 'google12', 'maverick', 'corvette',
  'candlewise', 'candlewise1', 'bonsai12', 'bonsai123', 'bonsaitree', 'pinetree', 'pinetree1',
]);

export function isCommonPassword(pw: string): boolean {
  const p = pw.toLowerCase();
  if (commonPasswords.has(p)) return true;
  // One character repeated, or a plain run of digits, is as weak as anything on the list.
  if (/^(.)\1+$/.test(p)) return true;
  if (/^\d+$/.test(p) && p.length <= 10) return true;
  return false;
}
