// After hydration (so server and client render the same text first), quantity fields follow the browser's language.
export default defineNuxtPlugin((nuxtApp) => {
  const locale = useInputLocale()
  nuxtApp.hook('app:mounted', () => {
    locale.value = navigator.language || 'en-GB'
  })
})
