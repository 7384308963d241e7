#include "app/interrupt.hpp"

#include <csignal>

namespace rotcap::app {

namespace {

volatile std::sig_atomic_t g_interrupted = 0;

extern "C" void on_signal(int signal) {
  g_interrupted = 1;
  std::signal(signal, SIG_DFL);  // a second signal ends the process at once
}

}  // namespace

void install_interrupt_handlers() {
  std::signal(SIGINT, on_signal);
  std::signal(SIGTERM, on_signal);
}

bool interrupt_requested() { return g_interrupted != 0; }

}  // namespace rotcap::app
