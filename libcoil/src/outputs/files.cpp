#include "libcoil/outputs/files.hpp"

#include <fcntl.h>
#include <signal.h>
#include <sys/file.h>
#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <map>
#include <string>

#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

namespace fs = std::filesystem;

std::string suffix() { return ".tmp." + std::to_string(::getpid()); }

// Writes `content` to `path` and syncs it; nothing is left behind on failure. `shown` names the file in
// the error (its final name).
void write_synced(const fs::path& path, std::string_view content, const fs::path& shown) {
    std::FILE* f = std::fopen(path.c_str(), "wb");
    if (!f) throw InputError(shown.string(), std::string("cannot write: ") + std::strerror(errno));
    const bool ok = std::fwrite(content.data(), 1, content.size(), f) == content.size() && std::fflush(f) == 0 &&
                    ::fsync(::fileno(f)) == 0;
    const int err = errno;
    if (std::fclose(f) != 0 || !ok) {
        std::remove(path.c_str());
        throw InputError(shown.string(), std::string("cannot write: ") + std::strerror(err));
    }
}

// The temporaries an earlier run of this library left when it was killed: NAME.tmp.PID beside each final
// name (and .DIR.tmp.PID directories beside a directory) whose process no longer runs. Only the set's own
// names are looked at, so nothing of the user's is touched.
void remove_stale(const fs::path& final_name) {
    std::error_code ec;
    const fs::path dir = final_name.has_parent_path() ? final_name.parent_path() : fs::path(".");
    const std::string stem = final_name.filename().string() + ".tmp.";
    for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
        const std::string name = it->path().filename().string();
        if (name.compare(0, stem.size(), stem) != 0) continue;
        const std::string pid = name.substr(stem.size());
        if (pid.empty() || pid.size() > 9 || pid.find_first_not_of("0123456789") != std::string::npos) continue;
        const auto p = static_cast<pid_t>(std::stol(pid));
        if (p == ::getpid() || !(::kill(p, 0) != 0 && errno == ESRCH)) continue;
        fs::remove_all(it->path(), ec);
    }
}

// Holds an exclusive lock on a directory while a set is moved into it, so that two runs writing into the
// same directory never interleave their sets: each set lands whole, the later one over the earlier.
class DirectoryLock {
public:
    explicit DirectoryLock(const fs::path& dir) : fd_(::open(dir.c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC)) {
        if (fd_ >= 0) ::flock(fd_, LOCK_EX);
    }
    ~DirectoryLock() {
        if (fd_ >= 0) ::close(fd_);  // releases the lock
    }
    DirectoryLock(const DirectoryLock&) = delete;
    DirectoryLock& operator=(const DirectoryLock&) = delete;

private:
    int fd_;
};

// A set into a directory that does not exist yet: written whole into .DIR.tmp.PID beside it, then renamed
// to DIR in one step. False (nothing left) when DIR appeared meanwhile, for the caller to write file by file.
bool write_as_new_directory(const fs::path& dir, const FileSet& files) {
    const fs::path parent = dir.has_parent_path() ? dir.parent_path() : fs::path(".");
    std::error_code ec;
    fs::create_directories(parent, ec);
    if (ec) throw InputError(parent.string(), "cannot create the directory: " + ec.message());
    remove_stale(parent / ("." + dir.filename().string()));
    const fs::path staging = parent / ("." + dir.filename().string() + suffix());
    fs::remove_all(staging, ec);
    if (!fs::create_directory(staging, ec) || ec) {
        throw InputError(dir.string(), "cannot create the directory: " + (ec ? ec.message() : std::string("it exists")));
    }
    try {
        for (const auto& [path, content] : files) write_synced(staging / path.filename(), content, path);
    } catch (...) {
        fs::remove_all(staging, ec);
        throw;
    }
    fs::rename(staging, dir, ec);
    if (!ec) return true;
    fs::remove_all(staging, ec);
    return false;
}

// A set into an existing directory: every file staged beside its final name, then all renamed into place
// under the directory's lock; on a failure before the renames, what was staged is removed.
void write_into_directory(const fs::path& dir, const FileSet& files) {
    for (const auto& [path, content] : files) {
        std::error_code ec;
        if (fs::is_directory(path, ec)) throw InputError(path.string(), "is a directory; expected a file name to write");
        remove_stale(path);
    }
    std::vector<fs::path> staged;
    try {
        for (const auto& [path, content] : files) {
            staged.push_back(path.string() + suffix());
            write_synced(staged.back(), content, path);
        }
    } catch (...) {
        for (const auto& t : staged) std::remove(t.c_str());
        throw;
    }
    const DirectoryLock lock(dir);
    for (std::size_t i = 0; i < files.size(); ++i) {
        std::error_code ec;
        fs::rename(staged[i], files[i].first, ec);
        if (ec) {
            for (std::size_t j = i; j < staged.size(); ++j) std::remove(staged[j].c_str());
            throw InputError(files[i].first.string(), "cannot move the finished file into place: " + ec.message());
        }
    }
}

}  // namespace

void write_file_atomically(const fs::path& path, std::string_view content) { write_file_set({{path, std::string(content)}}); }

void write_file_set(const FileSet& files) {
    std::map<fs::path, FileSet> by_directory;
    for (const auto& f : files) {
        if (f.first.filename().empty()) throw InputError(f.first.string(), "names a directory; expected a file name to write");
        by_directory[f.first.has_parent_path() ? f.first.parent_path() : fs::path(".")].push_back(f);
    }
    for (const auto& [dir, set] : by_directory) {
        std::error_code ec;
        const bool exists = fs::exists(dir, ec);
        if (exists && !fs::is_directory(dir, ec)) throw InputError(dir.string(), "is a file; expected a directory to write into");
        if (!exists && write_as_new_directory(dir, set)) continue;
        write_into_directory(dir, set);
    }
}

}  // namespace libcoil
