// Stops a PostgreSQL cluster once the process that started it is gone, however it went (Ctrl-C,
// SIGTERM to its process group, SIGKILL, a crash). Plain Node with no dependency, started detached
// in a process group of its own so the signal that ends its owner does not end it too.
// Usage: node cluster-guardian.cjs <owner pid> <command> [args...]   (the command stops the cluster)
const { spawnSync } = require('node:child_process');

const [ownerPid, command, ...args] = process.argv.slice(2);

function ownerAlive() {
  try {
    process.kill(Number(ownerPid), 0);
    return true;
  } catch (error) {
    return error.code === 'EPERM';
  }
}

// The owner sends SIGTERM when it stops the cluster itself: then there is nothing left to do.
process.on('SIGTERM', () => process.exit(0));
const timer = setInterval(() => {
  if (ownerAlive()) return;
  clearInterval(timer);
  spawnSync(command, args, { stdio: 'ignore' });
  process.exit(0);
}, 500);
