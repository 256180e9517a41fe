"""Member mathematics beyond the prismatic member: haunched and tapered members (section
variation, exact flexibility, the member law) and certified polynomial pieces of their influence
functions."""
