"""Model-file texts shared by the input tests."""

GIRDER = """title = "22 m girder"
units = "kN-m"
[beam]
spans = [10.0, 12.0]
EI = 2.0e5
supports = ["pinned", "roller", "roller"]
names = ["A", "B", "C"]
"""

FRAME = """[[nodes]]
name = "A"
x = 0.0
y = 0.0
support = "pinned"
[[nodes]]
name = "B"
x = 10.0
y = 0.0
[[nodes]]
name = "C"
x = 20.0
y = 0.0
support = "roller"
[[members]]
name = "AB"
start = "A"
end = "B"
EI = 2.0e5
EA = 8.0e6
deck = true
[[members]]
name = "BC"
start = "B"
end = "C"
EI = 2.0e5
EA = 8.0e6
deck = true
[path]
members = ["AB", "BC"]
"""

RATING = """
[rating]
method = "LRFR"
material = "steel"
[[capacity]]
response = "moment"
sense = "positive"
"""
