#pragma once
/// The style sheet of the HTML report, inlined in its head.

namespace sifter::report {

/// CSS for screen and A4 print; the SVG figures' classes are styled here too.
const char* html_style();

}  // namespace sifter::report
