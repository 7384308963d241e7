#pragma once
// OptionError: a component's options struct holds a value its owner does not accept. Every owner
// validates its own options (SteelModel, ISection, HingeZoneSpec, PathOptions, ...) and names the
// option by its full case-file key ("steel.fy", "section.depth", "analysis.first_step"), with the
// value found and what is expected. io turns it into an InputError at the key's file and line; the command
// line maps one that reaches it unconverted to exit code 2 as well.
#include <stdexcept>
#include <string>

namespace rotcap {

class OptionError : public std::invalid_argument {
 public:
  /// key: the dotted case-file path ("steel.fy"; array items "member.stiffeners[2]");
  /// found: the value as text ("-5 MPa"); expected: the rule ("fy > 0 [MPa]").
  OptionError(std::string key, std::string found, std::string expected)
      : std::invalid_argument(key + ": found " + found + "; expected " + expected),
        key_(std::move(key)), found_(std::move(found)), expected_(std::move(expected)) {}
  const std::string& key() const { return key_; }
  const std::string& found() const { return found_; }
  const std::string& expected() const { return expected_; }

 private:
  std::string key_, found_, expected_;
};

}  // namespace rotcap
