// The product's validation words for schemas parsed in the browser (the Quick check validates as you type).
import '#shared/schemas/messages'

export default defineNuxtPlugin(() => {})
