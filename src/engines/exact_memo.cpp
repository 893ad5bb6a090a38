// One matrix exponential per distinct matrix in a run: the groups of a register repeat a few
// hundred chains and test intervals across thousands of SIFs.
#include "engines/exact_memo.hpp"

#include <unsupported/Eigen/MatrixFunctions>

namespace sifter::detail {

std::shared_ptr<const Eigen::MatrixXd> memo_exp(const Eigen::MatrixXd& m) {
  static MemoTable<Eigen::MatrixXd> table;
  return table.get(
      MemoKey().add(m).take(), [&] { return Eigen::MatrixXd(m.exp()); },
      [](const Eigen::MatrixXd& e) { return static_cast<std::size_t>(e.size()) * sizeof(double); });
}

}  // namespace sifter::detail
