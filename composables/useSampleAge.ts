/** How a sample's waiting time reads on the bench: hours under two days, then whole days. */
export function sampleAge(hours: number): string {
  return hours < 48 ? `${hours} h` : `${Math.floor(hours / 24)} d`
}
