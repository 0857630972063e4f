// A stand-in thread for the call pool's tests that cannot start.
throw new Error('this thread cannot start');
