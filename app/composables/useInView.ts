// Whether an element has come near the window: set once it first does, in the browser only (false while the server
// renders and during hydration, so both render the placeholder). Charts below the fold are drawn when scrolled to,
// not while the page first shows or while an edit repaints the results above them.
import type { Ref } from 'vue'

/** px beyond the window's edge that already count as in view, so a chart is drawn just before it is reached */
const AHEAD_PX = 300

export function useInView(target: Ref<HTMLElement | null>): Ref<boolean> {
  const seen = ref(false)
  let observer: IntersectionObserver | undefined
  onMounted(() => {
    if (!target.value || typeof IntersectionObserver === 'undefined') {
      seen.value = true
      return
    }
    observer = new IntersectionObserver((entries) => {
      if (!entries.some(e => e.isIntersecting)) return
      seen.value = true
      observer?.disconnect()
    }, { rootMargin: `${AHEAD_PX}px` })
    observer.observe(target.value)
  })
  onBeforeUnmount(() => observer?.disconnect())
  return seen
}
