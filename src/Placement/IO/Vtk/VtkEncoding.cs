namespace Placement.IO.Vtk;

/// <summary>How the data arrays of a VTK XML file are stored.</summary>
public enum VtkEncoding
{
    /// <summary>Inline base64 of raw little/big-endian bytes (<c>format="binary"</c>), each array preceded by a UInt64 byte count; compact and exact.</summary>
    Base64Binary,

    /// <summary>Inline decimal text (<c>format="ascii"</c>), shortest round-trip form; readable by eye, about 2× larger.</summary>
    Ascii,
}
