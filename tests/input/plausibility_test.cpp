// Specification of how warnings find the SIF they are about: by the SIF's pointer, a place
// inside it, or its id; never by a pointer that merely starts with the same characters.
#include "sifter/input/plausibility.hpp"

#include <gtest/gtest.h>

namespace sifter {
namespace {

struct Block {
  std::vector<std::string> warnings;
};

Project project_of_eleven_sifs() {
  Project p;
  for (int i = 0; i < 11; ++i) {
    Sif s;
    s.id = "SIF-" + std::to_string(100 + i);
    s.pointer = "/sifs/" + std::to_string(i);
    p.sifs.push_back(s);
  }
  return p;
}

TEST(SifWarnings, AWarningReachesTheSifItsPlaceOrIdNamesAndNoOther) {
  const Project p = project_of_eleven_sifs();
  const std::vector<Warning> warnings = {
      {"/sifs/1", "on the SIF itself"},
      {"/sifs/10/subsystems/0/channels/1", "inside SIF 10"},
      {"SIF-101", "by its id"},
      {"/sifs/1/target", "inside SIF 1"},
      {"/scenarios/0", "about a scenario"},
      {"/sifs/1x", "a place that only starts like SIF 1"},
  };
  std::vector<Block> blocks(p.sifs.size());
  attach_sif_warnings(p, warnings, blocks);
  EXPECT_EQ(blocks[1].warnings, (std::vector<std::string>{"on the SIF itself", "by its id", "inside SIF 1"}));
  EXPECT_EQ(blocks[10].warnings, (std::vector<std::string>{"inside SIF 10"}));
  for (std::size_t i : {0U, 2U, 3U, 9U}) EXPECT_TRUE(blocks[i].warnings.empty()) << i;
}

TEST(SifWarnings, AWarningNamingASifTwiceIsAttachedOnce) {
  Project p = project_of_eleven_sifs();
  p.sifs[3].id = "/sifs/3";  // an id that is also its pointer
  std::vector<Block> blocks(p.sifs.size());
  attach_sif_warnings(p, {{"/sifs/3", "once"}}, blocks);
  EXPECT_EQ(blocks[3].warnings, (std::vector<std::string>{"once"}));
}

}  // namespace
}  // namespace sifter
