







export type ServerCheck =
  | { kind: 'pending' }
  | { kind: 'agree' }
  | { kind: 'differ' }
  | { kind: 'error', message: string }
