// One root cause, one message: what follows only from a problem already reported is counted, not repeated.
#include <gtest/gtest.h>

#include "sifter/input/load.hpp"

namespace sifter {
namespace {

std::string message_of(const std::string& text) {
  try {
    (void)load_project_text(text, "p.json", SIFTER_TEST_DATA);
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

// Three SIFs of one subsystem each, all taking "mttr" from the defaults.
std::string three_sifs(const std::string& defaults, const std::string& libraries = "") {
  return R"({"format": "sifter-project/1", "defaults": )" + defaults + libraries + R"(,
  "components": [{"id": "A", "lambda_du": "100 FIT"}],
  "sifs": [{"id": "S1", "subsystems": [{"name": "s", "role": "sensor", "vote": "1oo1", "channels": ["A"]}]},
           {"id": "S2", "subsystems": [{"name": "s", "role": "sensor", "vote": "1oo1", "channels": ["A"]}]},
           {"id": "S3", "subsystems": [{"name": "s", "role": "sensor", "vote": "1oo1", "channels": ["A"]}]}]})";
}

TEST(RootCause, ABareNumberForMttrInTheDefaultsIsOneMessage) {
  const std::string message = message_of(three_sifs(R"({"proof_test_interval": "1 yr", "mttr": 8})"));
  EXPECT_NE(message.find("/defaults/mttr: expected a duration"), std::string::npos) << message;
  EXPECT_EQ(message.find("/sifs/"), std::string::npos) << message;
  EXPECT_NE(message.find("1 problem in the input (3 problems that follow only from it not shown)"), std::string::npos)
      << message;
}

TEST(RootCause, AMissingDefaultIsStillReportedOnEverySubsystemThatNeedsIt) {
  // Nothing was written for mttr, so there is no root problem to point at: each subsystem says it.
  const std::string message = message_of(three_sifs(R"({"proof_test_interval": "1 yr"})"));
  EXPECT_NE(message.find("3 problems in the input; nothing"), std::string::npos) << message;
}

TEST(RootCause, AMissingLibraryIsOneMessageNotOnePerModel) {
  const std::string text = R"({"format": "sifter-project/1", "libraries": ["no-such-library.json"],
  "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h"},
  "components": [{"id": "A", "model": "m1"}, {"id": "B", "model": "m2"}, {"id": "C", "model": "m3"}],
  "sifs": [{"id": "S1", "subsystems": [{"name": "s", "role": "sensor", "vote": "1oo1", "channels": ["A"]}]}]})";
  const std::string message = message_of(text);
  EXPECT_NE(message.find("/libraries/0: expected a readable file"), std::string::npos) << message;
  EXPECT_EQ(message.find("/components/"), std::string::npos) << message;
  EXPECT_NE(message.find("1 problem in the input (3 problems that follow only from it not shown)"), std::string::npos)
      << message;
}

TEST(RootCause, AnUnknownModelIsStillReportedWhenEveryLibraryLoaded) {
  const std::string text = R"({"format": "sifter-project/1", "libraries": ["../../data/components/illustrative.json"],
  "defaults": {"proof_test_interval": "1 yr", "mttr": "8 h"},
  "components": [{"id": "A", "model": "no-such-model"}],
  "sifs": [{"id": "S1", "subsystems": [{"name": "s", "role": "sensor", "vote": "1oo1", "channels": ["A"]}]}]})";
  const std::string message = message_of(text);
  EXPECT_NE(message.find("/components/0/model: expected the id of a model in the libraries"), std::string::npos)
      << message;
}

}  // namespace
}  // namespace sifter
