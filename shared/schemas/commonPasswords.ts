// A short list of commonly used passwords (10+ characters) refused at sign-up, as NIST SP 800-63B §5.1.1.2 asks.
// Common practice: the most frequent entries of public breach-frequency lists; from memory, not exhaustive.
const list = [
  '1234567890', '12345678910', '0123456789', '1111111111', '0000000000', '1q2w3e4r5t', 'qwertyuiop',
  'password12', 'password123', 'password1234', 'passw0rd123', 'iloveyou12', 'qwerty1234', 'qwerty12345',
  'abcdefghij', 'abc1234567', 'abcd123456', '1qaz2wsx3edc', 'zaq12wsxcde', 'letmein123', 'welcome123',
  'administrator', 'admin12345', 'changeme123', 'trustno1234', 'football123', 'baseball123', 'monkey1234',
  'dragon1234', 'sunshine123', 'princess123', 'starwars123', 'whatever123', 'superman123', 'michael123',
  'computer123', 'internet123', 'qazwsxedc123', '123qweasdzxc', 'asdfghjkl1', 'asdfghjkl;', 'zxcvbnm123',
  'passwordpassword', 'mypassword1', 'p@ssw0rd123', 'p@ssword123', 'secret1234', '9876543210', '123123123123',
  '1234512345', '5555555555', '7777777777', '9999999999', 'aaaaaaaaaa', 'q1w2e3r4t5', '1a2b3c4d5e',
]
const set = new Set(list)

/** Case-insensitive membership in the list. */
export function isCommonPassword(p: string): boolean {
  return set.has(p.toLowerCase())
}
