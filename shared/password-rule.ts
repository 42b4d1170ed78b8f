// The password rule, shown beside every password form and enforced by the server (server/utils/password-strength.ts).
export const PASSWORD_MIN_LENGTH = 12
export const PASSWORD_RULE = `At least ${PASSWORD_MIN_LENGTH} characters, not on a list of common passwords, not built from your name or e-mail, and not easy to guess (repeated characters, sequences, keyboard rows, dates). A few unrelated words make a good password.`
