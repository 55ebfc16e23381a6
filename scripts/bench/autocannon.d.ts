// autocannon ships no types; the load benchmark reads only what it prints (requests, latency, errors).
declare module 'autocannon' {
  const autocannon: (options: Record<string, unknown>) => Promise<any>
  export default autocannon
}
