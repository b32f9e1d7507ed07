package org.loadstone.files;

import java.io.IOException;
import java.net.URI;
import java.nio.channels.FileChannel;
import java.nio.channels.SeekableByteChannel;
import java.nio.file.AccessMode;
import java.nio.file.CopyOption;
import java.nio.file.DirectoryStream;
import java.nio.file.FileStore;
import java.nio.file.FileSystem;
import java.nio.file.FileSystemException;
import java.nio.file.LinkOption;
import java.nio.file.OpenOption;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.nio.file.attribute.FileAttribute;
import java.nio.file.attribute.FileAttributeView;
import java.nio.file.spi.FileSystemProvider;
import java.util.Iterator;
import java.util.Map;
import java.util.Set;

/** The {@link FakeDisk}'s provider: the real provider on the real paths, with its two faults. */
final class FakeProvider extends FileSystemProvider {
  private final FakeDisk disk;
  private final FileSystemProvider real;

  FakeProvider(FakeDisk disk, FileSystemProvider real) {
    this.disk = disk;
    this.real = real;
  }

  private static Path r(Path p) {
    return FakePath.unwrap(p);
  }

  @Override public String getScheme() {
    return "fakedisk";
  }

  @Override public FileSystem newFileSystem(URI uri, Map<String, ?> env) {
    throw new UnsupportedOperationException("make a fake disk with FakeDisk.create()");
  }

  @Override public FileSystem getFileSystem(URI uri) {
    return disk;
  }

  @Override public Path getPath(URI uri) {
    return disk.path(real.getPath(uri));
  }

  @Override public void createLink(Path link, Path existing) throws IOException {
    if (!disk.links) {
      disk.linksRefused.incrementAndGet();
      throw new FileSystemException(link.toString(), existing.toString(),
          "Operation not permitted");
    }
    real.createLink(r(link), r(existing));
  }

  @Override public FileChannel newFileChannel(Path path, Set<? extends OpenOption> options,
      FileAttribute<?>... attrs) throws IOException {
    return new LimitedChannel(real.newFileChannel(r(path), options, attrs), disk.bytesLeft);
  }

  @Override public SeekableByteChannel newByteChannel(Path path,
      Set<? extends OpenOption> options, FileAttribute<?>... attrs) throws IOException {
    return newFileChannel(path, options, attrs);
  }

  @Override public DirectoryStream<Path> newDirectoryStream(Path dir,
      DirectoryStream.Filter<? super Path> filter) throws IOException {
    DirectoryStream<Path> s = real.newDirectoryStream(r(dir), p -> filter.accept(disk.path(p)));
    return new DirectoryStream<>() {
      @Override public Iterator<Path> iterator() {
        Iterator<Path> it = s.iterator();
        return new Iterator<>() {
          @Override public boolean hasNext() {
            return it.hasNext();
          }

          @Override public Path next() {
            return disk.path(it.next());
          }
        };
      }

      @Override public void close() throws IOException {
        s.close();
      }
    };
  }

  @Override public void createDirectory(Path dir, FileAttribute<?>... attrs) throws IOException {
    real.createDirectory(r(dir), attrs);
  }

  @Override public void delete(Path path) throws IOException {
    long freed = 0;
    if (disk.freesOnDelete) {
      try {
        Map<String, Object> a = real.readAttributes(r(path), "unix:nlink,size");
        // a file with another name (a hard link) keeps its bytes on the disk
        freed = ((Number) a.get("nlink")).intValue() == 1 ? ((Number) a.get("size")).longValue()
            : 0;
      } catch (IOException | UnsupportedOperationException e) {
        freed = 0;
      }
    }
    real.delete(r(path));
    long f = freed;
    disk.bytesLeft.getAndUpdate(l -> l > Long.MAX_VALUE / 2 ? l : l + f);
  }

  @Override public void copy(Path source, Path target, CopyOption... options) throws IOException {
    real.copy(r(source), r(target), options);
  }

  @Override public void move(Path source, Path target, CopyOption... options) throws IOException {
    real.move(r(source), r(target), options);
  }

  @Override public boolean isSameFile(Path path, Path path2) throws IOException {
    return real.isSameFile(r(path), r(path2));
  }

  @Override public boolean isHidden(Path path) throws IOException {
    return real.isHidden(r(path));
  }

  /** The real store, reporting no more usable space than the fake disk has left. */
  @Override public FileStore getFileStore(Path path) throws IOException {
    FileStore store = real.getFileStore(r(path));
    return new FileStore() {
      @Override public String name() {
        return store.name();
      }

      @Override public String type() {
        return store.type();
      }

      @Override public boolean isReadOnly() {
        return store.isReadOnly();
      }

      @Override public long getTotalSpace() throws IOException {
        return store.getTotalSpace();
      }

      @Override public long getUsableSpace() throws IOException {
        return Math.min(store.getUsableSpace(), disk.bytesLeft.get());
      }

      @Override public long getUnallocatedSpace() throws IOException {
        return Math.min(store.getUnallocatedSpace(), disk.bytesLeft.get());
      }

      @Override public boolean supportsFileAttributeView(
          Class<? extends java.nio.file.attribute.FileAttributeView> type) {
        return store.supportsFileAttributeView(type);
      }

      @Override public boolean supportsFileAttributeView(String name) {
        return store.supportsFileAttributeView(name);
      }

      @Override public <V extends java.nio.file.attribute.FileStoreAttributeView> V
          getFileStoreAttributeView(Class<V> type) {
        return store.getFileStoreAttributeView(type);
      }

      @Override public Object getAttribute(String attribute) throws IOException {
        return store.getAttribute(attribute);
      }
    };
  }

  @Override public void checkAccess(Path path, AccessMode... modes) throws IOException {
    real.checkAccess(r(path), modes);
  }

  @Override public <V extends FileAttributeView> V getFileAttributeView(Path path, Class<V> type,
      LinkOption... options) {
    return real.getFileAttributeView(r(path), type, options);
  }

  @Override public <A extends BasicFileAttributes> A readAttributes(Path path, Class<A> type,
      LinkOption... options) throws IOException {
    return real.readAttributes(r(path), type, options);
  }

  @Override public Map<String, Object> readAttributes(Path path, String attributes,
      LinkOption... options) throws IOException {
    return real.readAttributes(r(path), attributes, options);
  }

  @Override public void setAttribute(Path path, String attribute, Object value,
      LinkOption... options) throws IOException {
    real.setAttribute(r(path), attribute, value, options);
  }
}
