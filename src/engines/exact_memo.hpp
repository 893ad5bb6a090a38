#pragma once
// Internals of the exact engine: results of costly matrix functions remembered across the SIFs
// of a run, keyed by the bytes of their inputs (never by SIF or by position in the project).
#include <Eigen/Dense>
#include <cstddef>
#include <cstring>
#include <memory>
#include <mutex>
#include <shared_mutex>
#include <string>
#include <string_view>
#include <unordered_map>
#include <utility>
#include <vector>

namespace sifter::detail {

/// The bytes of every input of one computation, in order: equal bytes, equal result.
class MemoKey {
 public:
  MemoKey& add(double v) { return raw(&v, sizeof v); }
  MemoKey& add(unsigned v) { return raw(&v, sizeof v); }
  MemoKey& add(const std::vector<double>& v) {
    return add(static_cast<unsigned>(v.size())).raw(v.data(), v.size() * sizeof(double));
  }
  template <typename Derived>
  MemoKey& add(const Eigen::DenseBase<Derived>& m) {
    const Eigen::Matrix<double, Eigen::Dynamic, Eigen::Dynamic> dense = m;
    add(static_cast<unsigned>(dense.rows())).add(static_cast<unsigned>(dense.cols()));
    return raw(dense.data(), static_cast<std::size_t>(dense.size()) * sizeof(double));
  }
  [[nodiscard]] std::string&& take() { return std::move(bytes_); }

 private:
  MemoKey& raw(const void* p, std::size_t n) {
    bytes_.append(static_cast<const char*>(p), n);
    return *this;
  }
  std::string bytes_;
};

/// Values computed once per distinct key and shared by every thread of the process. The table
/// stops growing at kMemoBudgetBytes of keys and values (a register of all-different groups
/// then recomputes instead of exhausting memory); it is never emptied, so values stay valid.
template <typename T>
class MemoTable {
 public:
  /// A budget per table: about 200 distinct chains of 25 states, each with 16 node columns.
  static constexpr std::size_t kMemoBudgetBytes = std::size_t{64} << 20;

  /// The value for `key`, computing it with `compute()` (outside the lock) when new.
  /// `bytes_of(value)` estimates the memory a value holds.
  template <typename Compute, typename BytesOf>
  std::shared_ptr<const T> get(std::string key, Compute&& compute, BytesOf&& bytes_of) {
    {
      std::shared_lock lock(mutex_);
      if (auto it = values_.find(key); it != values_.end()) return it->second;
    }
    auto value = std::make_shared<const T>(compute());
    const std::size_t cost = key.size() + bytes_of(*value);
    std::unique_lock lock(mutex_);
    if (auto it = values_.find(key); it != values_.end()) return it->second;  // another thread won
    if (bytes_ + cost > kMemoBudgetBytes) return value;
    bytes_ += cost;
    values_.emplace(std::move(key), value);
    return value;
  }

 private:
  std::shared_mutex mutex_;
  std::unordered_map<std::string, std::shared_ptr<const T>> values_;
  std::size_t bytes_ = 0;
};

/// exp(m), the Eigen Padé approximant with scaling and squaring, once per distinct matrix.
std::shared_ptr<const Eigen::MatrixXd> memo_exp(const Eigen::MatrixXd& m);

}  // namespace sifter::detail
