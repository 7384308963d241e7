#pragma once
// Graceful stop on SIGINT (Ctrl-C) and SIGTERM: the first signal only sets a flag, which a path run
// reads after each converged step; it then stops there, writes every output (curve.csv, fields, the
// summary with stop_reason "interrupted", report) and exits with code 3. A second signal ends the
// process at once (the handler restores the default action after the first).
namespace rotcap::app {

/// Installs the handlers (idempotent).
void install_interrupt_handlers();
/// True once SIGINT or SIGTERM has arrived.
bool interrupt_requested();

}  // namespace rotcap::app
