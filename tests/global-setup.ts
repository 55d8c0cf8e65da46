// API and browser suites need the throwaway database that `npm test` prepares; say so plainly when it is missing.
export default function setup() {
  if (!process.env.DATABASE_URL) {
    console.warn('DATABASE_URL is not set: run the suites through `npm test`, which prepares the database. Pure engine tests still run.');
  }
}
