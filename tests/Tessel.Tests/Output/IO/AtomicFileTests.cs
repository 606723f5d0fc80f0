using Tessel.Output.IO;

namespace Tessel.Tests.Output.IO;

public class AtomicFileTests
{
    [Fact]
    public void ReplacesTheFileAndLeavesNoTemporary()
    {
        string dir = TestPaths.NewTempFolder();
        string path = Path.Combine(dir, "a.txt");
        AtomicFile.Write(path, "first"u8);
        AtomicFile.Write(path, "second"u8);
        Assert.Equal("second", File.ReadAllText(path));
        Assert.Single(Directory.GetFiles(dir));
    }

    [Fact]
    public void MissingFolderFailsWithoutCreatingAnything()
    {
        string dir = Path.Combine(TestPaths.NewTempFolder(), "missing");
        Assert.ThrowsAny<IOException>(() => AtomicFile.Write(Path.Combine(dir, "a.txt"), "x"u8));
        Assert.False(Directory.Exists(dir));
    }
}
