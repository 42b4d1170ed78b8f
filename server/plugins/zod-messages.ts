import { installProductMessages } from '#shared/schemas/messages'

// Validation words in the product's own language for every schema the server parses (see shared/schemas/messages.ts).
export default defineNitroPlugin(() => {
  installProductMessages()
})
