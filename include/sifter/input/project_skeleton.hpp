#pragma once
/// The commented project that `sifter init` writes: every section once, ready for `check`.
#include <string>

namespace sifter {

/// The project file's text. `library_file` is the name of the library written beside it;
/// `example` gives the worked example's titles (the README shows that file whole), otherwise
/// the titles say what to write there. Both texts load and verify as they are.
std::string project_skeleton(const std::string& library_file, bool example);

/// The small component library the skeleton names under "libraries" (invented figures).
std::string library_skeleton();

}  // namespace sifter
