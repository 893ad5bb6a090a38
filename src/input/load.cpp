// Reading a project file: bytes, structure, JSON, sections, libraries, then graph validation.
#include "sifter/input/load.hpp"

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <future>

#include "input/json_tree.hpp"
#include "input/load_parts.hpp"
#include "input/load_pressure.hpp"
#include "input/load_reuse.hpp"
#include "input/parse_source.hpp"
#include "sifter/graph/plant_graph.hpp"
#include "sifter/input/json_comments.hpp"
#include "sifter/input/json_source.hpp"
#include "sifter/input/sha256.hpp"
#include "sifter/model/cores.hpp"

namespace sifter {
namespace fs = std::filesystem;
using detail::Json;
using detail::LoadContext;
using detail::ObjectReader;

namespace {

[[noreturn]] void fail_with(const std::string& file, const std::string& expected, const std::string& found,
                            const std::string& hint = {}) {
  Diagnostic d;
  d.file = file;
  d.expected = expected;
  d.found = found;
  d.hint = hint;
  throw InputError({d});
}

// Reads a whole file, refusing directories, special files and sizes beyond kMaxInputBytes.
std::string read_file_bounded(const std::string& path, LoadContext* ctx, int source, const std::string& pointer) {
  std::error_code ec;
  const auto status = fs::status(path, ec);
  auto problem = [&](const std::string& expected, const std::string& found, const std::string& hint) -> std::string {
    if (ctx) {
      ctx->error(source, pointer, expected, found, hint);
      return {};
    }
    fail_with(path, expected, found, hint);
  };
  if (ec || !fs::exists(status)) return problem("a readable file", "no file at \"" + path + "\"", "check the path");
  if (fs::is_directory(status))
    return problem("a file", "a directory at \"" + path + "\"", "name the JSON file itself");
  if (!fs::is_regular_file(status)) return problem("a regular file", "a special file at \"" + path + "\"", "");
  const auto size = fs::file_size(path, ec);
  if (!ec && size > kMaxInputBytes)
    return problem("a file of at most " + std::to_string(kMaxInputBytes / (1024 * 1024)) + " MiB",
                   std::to_string(size / (1024 * 1024)) + " MiB", "split the register into several projects");
  std::ifstream in(path, std::ios::binary);
  if (!in) return problem("a readable file", "\"" + path + "\" cannot be opened", "check its permissions");
  // Read in one piece into a text of the file's size (a string stream would copy it twice more);
  // a file that grows meanwhile is read to its end all the same, within the bound.
  std::string text;
  // Room for the parser's padding, which parse_source zeroes: the text is then parsed where it lies.
  text.reserve((ec ? 0 : static_cast<std::size_t>(size)) + detail::kParserPadding);
  text.resize(ec ? 0 : static_cast<std::size_t>(size));
  in.read(text.data(), static_cast<std::streamsize>(text.size()));
  text.resize(static_cast<std::size_t>(in.gcount()));
  char more[65536];
  while (in.read(more, sizeof more) || in.gcount() > 0) {
    text.append(more, static_cast<std::size_t>(in.gcount()));
    if (text.size() > kMaxInputBytes)
      return problem("a file of at most " + std::to_string(kMaxInputBytes / (1024 * 1024)) + " MiB", "more than that",
                     "split the register into several projects");
  }
  if (in.bad())  // a read that failed part way: never a text cut short
    return problem("a readable file", "\"" + path + "\" could not be read to its end",
                   "check the disk and the file's permissions");
  return text;
}

void read_defaults(LoadContext& ctx, const Json& root, Project& project) {
  auto it = root.find("defaults");
  if (it == root.end()) return;
  ObjectReader r(ctx, *it, "/defaults", 0, "the defaults");
  project.defaults.proof_test_interval = r.duration("proof_test_interval");
  project.defaults.mttr = r.duration("mttr");
  project.defaults.mrt = r.duration("mrt");
  if (auto mission = r.duration("mission_time")) {
    project.defaults.mission_time = *mission;
    project.defaults.mission_time_defaulted = false;
    if (mission->hours <= 0.0) ctx.error(0, r.at("mission_time"), "a positive mission time", "zero");
  }
  r.finish();
}

// The project's own keys: format, title, document control and the project-wide choices.
void read_header(LoadContext& ctx, ObjectReader& top, Project& project) {
  if (auto format = top.string("format", true)) {
    project.format = *format;
    if (*format != kProjectFormat)
      ctx.error(0, "/format", std::string("\"") + kProjectFormat + "\"", "\"" + *format + "\"",
                "this version of sifter reads sifter-project/1");
  }
  project.title = top.string("title").value_or("");
  top.allow({"note", "revision", "author"});
  top.string("$schema");  // where an editor finds the schema; sifter needs nothing from it
  project.document = detail::read_document(top);
  project.constraints = detail::parse_constraint_basis(top.choice("constraints", {"iec61511", "route_1h", "route_2h"}));
  if (const auto judge_on = top.choice("judge_on", {"conservative", "simplified", "exact"}))
    project.judge_on = *judge_on == "simplified" ? JudgeOn::kSimplified
                       : *judge_on == "exact"    ? JudgeOn::kExact
                                                 : JudgeOn::kConservative;
}

// Components and SIFs are read on two cores: neither section depends on the other (a SIF names
// its components by id, resolved later by the graph). The SIFs' problems and warnings are
// collected apart and appended after the components', so that the messages, their order and
// the cap on how many are kept are those of one reader going through the file.
void read_components_and_sifs(LoadContext& ctx, Json& root, const detail::ModelIndex& models, Project& project) {
  LoadContext sif_ctx;
  for (const auto& source : ctx.sources) sif_ctx.sources.push_back({source.path, {}});  // paths only
  sif_ctx.deferred = ctx.deferred;  // the SIFs' elements: only this thread builds them
  sif_ctx.problems = ctx.problems;  // a problem of "defaults" is seen by the SIFs that inherit it
  sif_ctx.problems_not_kept = ctx.problems_not_kept;
  const std::size_t kept_before = ctx.problems.size();
  const std::size_t counted_before = ctx.problems_not_kept;
  auto sifs = alongside(0, [&] { detail::read_sifs(sif_ctx, root, project); });
  detail::read_components(ctx, root, models, project);  // touches project.components only
  sifs.get();                                           // read_sifs touches project.sifs only
  for (std::size_t i = kept_before; i < sif_ctx.problems.size(); ++i) {
    if (ctx.problems.size() >= kMaxReportedProblems)
      ++ctx.problems_not_kept;
    else
      ctx.problems.push_back(std::move(sif_ctx.problems[i]));
  }
  ctx.problems_not_kept += sif_ctx.problems_not_kept - counted_before;  // those beyond the cap among the SIFs'
  ctx.follow_ons_suppressed += sif_ctx.follow_ons_suppressed;
  for (auto& w : sif_ctx.warnings) ctx.warnings.push_back(std::move(w));
}

// The project's tree, and the digest of its bytes as read into `sha256`. The digest is
// computed on a second core while the text is parsed. The parse blanks comments in place, so a
// text that may hold some is hashed from a copy, and any other where it lies: padded first, so
// that the parse does not move it, and the digest is taken before the libraries' texts join the
// list that holds it.
std::optional<Json> parse_project(LoadContext& ctx, std::string& sha256) {
  detail::reserve_parser_padding(ctx.sources[0].text);
  const std::string& bytes = ctx.sources[0].text;
  auto digest = may_hold_json_comments(bytes)
                    ? alongside(0, [copy = bytes] { return sha256_hex(copy); })
                    : alongside(0, [view = std::string_view(bytes)] { return sha256_hex(view); });
  // The long sections are built element by element as they are read, never as a whole tree.
  auto root = detail::parse_source(ctx, 0, {"components", "sifs", "scenarios"});
  sha256 = digest.get();
  return root;
}

LoadedProject load_from(LoadContext& ctx, const std::string& base_dir) {
  LoadedProject out;
  Project& project = out.project;
  project.file = ctx.sources[0].path;
  auto root = parse_project(ctx, out.sha256);
  if (!root) throw InputError(ctx.located());
  ObjectReader top(ctx, *root, "", 0, "a project");
  if (!top.is_object()) throw InputError(ctx.located());
  read_header(ctx, top, project);
  top.member("defaults");
  read_defaults(ctx, *root, project);
  detail::ModelIndex models;
  std::error_code ec;
  std::vector<std::string> chain{fs::weakly_canonical(project.file, ec).string()};
  detail::read_libraries(ctx, top, base_dir, models, chain);
  // Each section's JSON is released once it is read, so that a large register is never held
  // twice (as JSON and as structs) at its full size.
  detail::ReuseRecord reuse = detail::expand_reuse(ctx, *root, top);
  top.member("components");
  top.member("sifs");
  read_components_and_sifs(ctx, *root, models, project);
  detail::name_templated_subsystems(reuse, project);
  // The signal-flow graph needs only the components and SIFs, complete from here on: built on
  // the second core while the rest is read (which writes no components or SIFs).
  // It also finds the components several SIFs share, the one thing verification asks of it,
  // and is freed on that core.
  auto plant = alongside(0, [&project] { return plant_findings(project); });
  // Released by value, never erased: the reader holds views of the keys it read (json_reader.hpp).
  for (const char* section : {"components", "sifs"})
    if (auto it = root->find(section); it != root->end()) *it = nullptr;
  top.member("risk_criteria");
  top.member("scenarios");
  top.member("lopa");
  detail::read_scenarios(ctx, *root, project);
  ctx.deferred.reset();  // every section is read: the parse's document is freed
  detail::finish_reuse(ctx, reuse, project);
  top.member("pressure");
  top.member("options");
  detail::read_pressure(ctx, *root, project);
  top.finish();
  detail::check_project_plausibility(ctx, project);
  if (ctx.problems.empty()) out.pressure = detail::screen_and_generate(ctx, project);
  if (ctx.problems.empty()) {  // otherwise the findings are dropped unread (the future joins on return or throw)
    PlantFindings findings = plant.get();
    const auto graph_problems = adopt_project_graph(project, findings);
    if (graph_problems.empty()) out.shared_components = std::move(findings.shared);
    for (const auto& p : graph_problems) ctx.error(0, p.pointer, p.expected, p.found, p.hint);
    if (graph_problems.empty()) detail::check_diverse_groups(ctx, project);
  }
  detail::settle_reuse_problems(ctx, reuse);
  if (!ctx.problems.empty()) throw InputError(ctx.located(), ctx.follow_ons_suppressed);
  out.warnings = std::move(ctx.warnings);
  for (const auto& source : ctx.sources) out.inputs.push_back(source.path);
  return out;
}

}  // namespace

namespace detail {

void read_libraries(LoadContext& ctx, ObjectReader& owner, const std::string& base_dir, ModelIndex& models,
                    std::vector<std::string>& chain) {
  const int owner_source = owner.source();
  const auto paths = owner.strings("libraries");
  for (std::size_t i = 0; i < paths.size(); ++i) {
    const std::string pointer = owner.at("libraries") + "/" + std::to_string(i);
    const fs::path resolved = (fs::path(base_dir) / paths[i]).lexically_normal();
    // A symbolic-link loop has no canonical form: the error code keeps it a problem of the input.
    std::error_code loop;
    const std::string canonical = fs::weakly_canonical(resolved, loop).string();
    if (loop) {
      ctx.error(owner_source, pointer, "a readable library file", "\"" + paths[i] + "\": " + loop.message(),
                "check the path; a symbolic link that points at itself never reaches a file");
      continue;
    }
    if (std::find(chain.begin(), chain.end(), canonical) != chain.end()) {
      std::string cycle;
      for (const auto& c : chain) cycle += fs::path(c).filename().string() + " -> ";
      ctx.error(owner_source, pointer, "libraries that do not include each other in a cycle",
                "the cycle " + cycle + fs::path(canonical).filename().string(), "remove one of the includes");
      continue;
    }
    std::string text = read_file_bounded(resolved.string(), &ctx, owner_source, pointer);
    if (text.empty()) continue;
    const int source = static_cast<int>(ctx.sources.size());
    ctx.sources.push_back({resolved.string(), std::move(text)});  // moved: its padding stays with it
    auto lib = detail::parse_source(ctx, source);
    if (!lib) continue;
    ObjectReader r(ctx, *lib, "", source, "a component library");
    if (!r.is_object()) continue;
    if (auto format = r.string("format", true); format && *format != kLibraryFormat)
      ctx.error(source, "/format", std::string("\"") + kLibraryFormat + "\"", "\"" + *format + "\"");
    r.allow({"title", "note", "caution", "source"});
    r.string("$schema");
    chain.push_back(canonical);
    read_libraries(ctx, r, resolved.parent_path().string(), models, chain);
    chain.pop_back();
    if (const Json* entries = r.require("models", "an array of component models")) {
      if (!entries->is_array()) {
        ctx.error(source, "/models", "an array of component models", describe(*entries));
      } else {
        for (std::size_t j = 0; j < entries->size(); ++j) {
          const std::string mp = "/models/" + std::to_string(j);
          const Json& e = (*entries)[j];
          check_model_entry(ctx, e, source, mp);
          if (!e.is_object() || !e.contains("id") || !e["id"].is_string()) continue;
          const std::string id = e["id"].get<std::string>();
          if (models.count(id)) {
            ctx.error(source, mp + "/id", "a model id defined once across the libraries", "\"" + id + "\" again",
                      "rename one of them");
            continue;
          }
          models[id] = ModelEntry{e, source, mp};
        }
      }
    }
    r.finish();
  }
}

}  // namespace detail

LoadedProject load_project_text(const std::string& text, const std::string& name, const std::string& base_dir) {
  LoadContext ctx;
  ctx.sources.push_back({name, text});
  return load_from(ctx, base_dir);
}

LoadedProject load_project_file(const std::string& path) {
  LoadContext ctx;
  ctx.sources.push_back({path, read_file_bounded(path, nullptr, 0, "")});  // the one copy of the text
  const std::string base = fs::path(path).parent_path().string();
  return load_from(ctx, base.empty() ? "." : base);
}

}  // namespace sifter
