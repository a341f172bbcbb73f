/** The rule the server applies (backend password rules), said once for every password field. */
export const PASSWORD_RULE = 'At least 8 characters. Long passphrases are welcome; very common passwords are refused.';
