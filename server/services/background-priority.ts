// How far below the request thread the background worker threads (thumbnails, Monte Carlo simulations) run.
// Linux nice values are per thread: +10 leaves these threads most of the CPU when nothing else wants it, and
// lets the API's own thread in first when a read arrives while every core is busy.
export const BACKGROUND_THREAD_NICE = 10;
