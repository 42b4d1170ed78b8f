import { installProductMessages } from '#shared/schemas/messages'

// The product's validation words for schemas parsed in the browser (the Quick check validates as you type).
export default defineNuxtPlugin(() => {
  installProductMessages()
})
