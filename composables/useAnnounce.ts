/**
 * Says a confirmation or an error once, politely, through the layout's one live region
 * (`<NuxtAnnouncer>`); the same words said again are announced again.
 */
export function useAnnounce() {
  const { polite } = useAnnouncer()
  return (text: string) => {
    polite('')
    if (text) void nextTick(() => polite(text))
  }
}
