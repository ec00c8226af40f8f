#include "sheetmill/batch/runner.hpp"

#include <cpl_conv.h>
#include <fcntl.h>
#include <fmt/format.h>
#include <poll.h>
#include <sched.h>
#include <signal.h>
#include <sys/prctl.h>
#include <sys/wait.h>
#include <unistd.h>

#include <algorithm>
#include <cerrno>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <cstring>

#include "batch/worker_protocol.hpp"
#include "sheetmill/batch/leftovers.hpp"
#include "sheetmill/batch/progress.hpp"
#include "sheetmill/core/error.hpp"
#include "sheetmill/core/log.hpp"
#include "sheetmill/core/temp_registry.hpp"

namespace sheetmill::batch {

namespace {

struct Worker {
  int slot = 0;
  pid_t pid = -1;
  int job_fd = -1;     // parent writes job numbers
  int result_fd = -1;  // parent reads outcomes
  long current = -1;   // job in progress, -1 when idle
  std::string buffer;
};

// The worker's whole life: set up once, then one sheet per job number until end of file.
[[noreturn]] void worker_main(int job_fd, int result_fd, const std::vector<SheetJob>& jobs,
                              const WorkerSetup& setup, const RunOptions& options, int slot) {
  // A sheet's warnings go to its report (and a count to the progress line); on the terminal
  // they would tear the progress bar and drown the log, unless asked for with --verbose.
  if (log::level() > log::Level::debug) log::set_level(log::Level::error);
  // The workers already fill the CPUs; GDAL's own threads would only compete with them.
  if (options.workers > 1) CPLSetConfigOption("GDAL_NUM_THREADS", "1");
  SheetTasks tasks;
  std::string setup_error;
  try {
    tasks = setup();
  } catch (const std::exception& e) {
    // Every sheet this worker takes fails with the reason, so the report says why.
    setup_error = std::string("the worker could not start: ") + e.what();
  }
  std::uint32_t index = 0;
  while (detail::read_exact(job_fd, &index, sizeof index)) {
    if (index >= jobs.size()) break;
    SheetOutcome o;
    if (setup_error.empty()) {
      o = process_sheet(jobs[index], tasks, options);
    } else {
      o.id = jobs[index].id;
      o.name = jobs[index].name;
      o.output = jobs[index].output;
      o.error = setup_error;
    }
    o.worker = slot;
    if (!detail::write_all(result_fd, detail::frame(detail::encode_outcome(o)))) break;
  }
  int code = 0;
  std::fflush(stderr);
  // No static destructors or atexit handlers of the parent's libraries in a forked child.
  ::_exit(code);
}

Worker spawn(int slot, const std::vector<SheetJob>& jobs, const WorkerSetup& setup,
             const RunOptions& options, const std::vector<Worker>& others) {
  int to_worker[2], from_worker[2];
  if (::pipe2(to_worker, O_CLOEXEC) != 0 || ::pipe2(from_worker, O_CLOEXEC) != 0) {
    throw_internal_error(std::string("cannot create pipes: ") + std::strerror(errno));
  }
  std::fflush(stdout);
  std::fflush(stderr);
  pid_t parent = ::getpid();
  pid_t pid = ::fork();
  if (pid < 0) throw_internal_error(std::string("cannot fork a worker: ") + std::strerror(errno));
  if (pid == 0) {
    // Die with the batch: a killed batch must not leave workers finishing sheets behind a rerun.
    ::prctl(PR_SET_PDEATHSIG, SIGKILL);
    if (::getppid() != parent) ::_exit(4);
    // The parent's handlers (a test framework's, a crash reporter's) are not the worker's:
    // a crash must end the worker, which the batch then reports.
    for (int sig : {SIGPIPE, SIGABRT, SIGSEGV, SIGBUS, SIGFPE, SIGILL}) {
      ::signal(sig, SIG_DFL);
    }
    // An interrupted worker removes the temporaries of the sheet it was writing, then dies of
    // the signal; the parent's registry (and its other workers) are not its own.
    forget_inherited_temps_and_children();
    install_temp_cleanup_on_signals();
    for (const Worker& w : others) {
      ::close(w.job_fd);
      ::close(w.result_fd);
    }
    ::close(to_worker[1]);
    ::close(from_worker[0]);
    worker_main(to_worker[0], from_worker[1], jobs, setup, options, slot);
  }
  ::close(to_worker[0]);
  ::close(from_worker[1]);
  register_child(pid);  // a signal to the batch reaches the worker's clean-up first
  Worker w;
  w.slot = slot;
  w.pid = pid;
  w.job_fd = to_worker[1];
  w.result_fd = from_worker[0];
  return w;
}

std::string exit_text(int status) {
  if (WIFSIGNALED(status)) {
    return fmt::format("the worker process was killed by signal {} ({})", WTERMSIG(status),
                       strsignal(WTERMSIG(status)));
  }
  if (WIFEXITED(status))
    return fmt::format("the worker process exited with code {}", WEXITSTATUS(status));
  return "the worker process ended";
}

}  // namespace

int usable_cpus() {
  int n = 1;
  cpu_set_t set;
  if (::sched_getaffinity(0, sizeof set, &set) == 0) n = std::max(1, CPU_COUNT(&set));
  if (const char* s = std::getenv("SLURM_CPUS_PER_TASK")) {
    int v = std::atoi(s);
    if (v > 0) n = std::min(n, v);
  }
  return n;
}

BatchResult run_batch(const std::vector<SheetJob>& jobs, const WorkerSetup& setup,
                      const RunOptions& options) {
  auto t0 = std::chrono::steady_clock::now();
  BatchResult result;
  result.outcomes.resize(jobs.size());
  if (jobs.empty()) return result;
  int removed = remove_leftovers(jobs);
  if (removed > 0) log::info("batch: removed {} temporary files left by an earlier run", removed);

  int n_workers = options.workers > 0 ? options.workers : usable_cpus();
  n_workers = std::max(1, std::min<int>(n_workers, static_cast<int>(jobs.size())));
  result.workers = n_workers;
  RunOptions worker_options = options;
  worker_options.workers = n_workers;
  log::debug("batch: {} sheets on {} worker processes", jobs.size(), n_workers);

  // A worker that dies must not kill the batch with SIGPIPE when it is sent its next job.
  struct sigaction ignore {
  }, previous{};
  ignore.sa_handler = SIG_IGN;
  ::sigaction(SIGPIPE, &ignore, &previous);

  Progress progress(static_cast<int>(jobs.size()), options.progress);
  std::vector<Worker> workers;
  std::size_t next = 0;
  std::size_t done = 0;
  auto record = [&](std::size_t index, SheetOutcome o) {
    if (options.on_outcome) options.on_outcome(o);
    progress.sheet_done(o);
    result.outcomes[index] = std::move(o);
    ++done;
  };
  auto assign = [&](Worker& w) {
    while (next < jobs.size()) {
      std::uint32_t index = static_cast<std::uint32_t>(next);
      std::string bytes(reinterpret_cast<const char*>(&index), sizeof index);
      if (!detail::write_all(w.job_fd, bytes)) return;  // dead; its end of file will show
      w.current = static_cast<long>(next++);
      return;
    }
    // Nothing left: closing the pipe tells the worker to exit.
    if (w.job_fd >= 0) {
      ::close(w.job_fd);
      w.job_fd = -1;
    }
  };

  try {
    for (int slot = 0; slot < n_workers; ++slot) {
      workers.push_back(spawn(slot, jobs, setup, worker_options, workers));
    }
    for (Worker& w : workers) assign(w);
    while (!workers.empty()) {
      std::vector<pollfd> fds;
      for (const Worker& w : workers) fds.push_back({w.result_fd, POLLIN, 0});
      int ready = ::poll(fds.data(), fds.size(), 500);
      if (ready < 0 && errno != EINTR) throw_internal_error("poll failed on batch workers");
      progress.tick();
      for (std::size_t k = 0; k < fds.size(); ++k) {
        if (!(fds[k].revents & (POLLIN | POLLHUP | POLLERR))) continue;
        Worker& w = workers[k];
        char buf[65536];
        ssize_t r = ::read(w.result_fd, buf, sizeof buf);
        if (r > 0) {
          w.buffer.append(buf, static_cast<std::size_t>(r));
          while (w.buffer.size() >= 4) {
            std::uint32_t len = 0;
            for (int i = 0; i < 4; ++i) {
              len |= std::uint32_t(static_cast<unsigned char>(w.buffer[i])) << (8 * i);
            }
            if (w.buffer.size() < 4 + std::size_t(len)) break;
            SheetOutcome o = detail::decode_outcome(w.buffer.substr(4, len));
            w.buffer.erase(0, 4 + std::size_t(len));
            if (w.current >= 0) {
              record(static_cast<std::size_t>(w.current), std::move(o));
              w.current = -1;
            }
            assign(w);
          }
          continue;
        }
        if (r < 0 && errno == EINTR) continue;
        // End of file: the worker is gone, normally or not.
        int status = 0;
        ::waitpid(w.pid, &status, 0);
        unregister_child(w.pid);
        ::close(w.result_fd);
        if (w.job_fd >= 0) ::close(w.job_fd);
        w.pid = -1;
        if (w.current >= 0) {
          SheetOutcome o;
          const SheetJob& j = jobs[static_cast<std::size_t>(w.current)];
          o.id = j.id;
          o.name = j.name;
          o.output = j.output;
          o.status = SheetStatus::failed;
          o.error = exit_text(status) + " while rendering this sheet";
          o.worker = w.slot;
          record(static_cast<std::size_t>(w.current), std::move(o));
          w.current = -1;
        } else if (!(WIFEXITED(status) && WEXITSTATUS(status) == 0) && next < jobs.size()) {
          // It could not even start; others would fail alike. Fail the rest rather than loop.
          throw_input_error("batch", "a worker could not start (" + exit_text(status) + ")");
        }
        int slot = w.slot;
        workers.erase(workers.begin() + static_cast<long>(k));
        if (next < jobs.size()) {
          workers.push_back(spawn(slot, jobs, setup, worker_options, workers));
          assign(workers.back());
        }
        break;  // the pollfd list no longer matches the workers
      }
    }
  } catch (...) {
    for (Worker& w : workers) {
      if (w.pid > 0) {
        ::kill(w.pid, SIGKILL);
        ::waitpid(w.pid, nullptr, 0);
        unregister_child(w.pid);
      }
      if (w.job_fd >= 0) ::close(w.job_fd);
      if (w.result_fd >= 0) ::close(w.result_fd);
    }
    ::sigaction(SIGPIPE, &previous, nullptr);
    throw;
  }
  ::sigaction(SIGPIPE, &previous, nullptr);
  progress.finish();
  if (done != jobs.size()) throw_internal_error("batch ended with sheets unaccounted for");
  result.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  return result;
}

}  // namespace sheetmill::batch
