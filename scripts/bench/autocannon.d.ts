// autocannon ships no types; the load benchmark reads only what it prints (requests, latency, errors).
declare module 'autocannon' {
  interface Result {
    requests: { average: number, total: number }
    latency: { p50: number, p99: number, average: number }
    errors: number
    timeouts: number
    non2xx: number
    [figure: string]: unknown
  }
  const autocannon: (options: Record<string, unknown>) => Promise<Result>
  export default autocannon
}
